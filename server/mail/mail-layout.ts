// Builds the text and HTML parts of every mail from one description, so both always say the same.
// No remote images or styles: everything is inline, and links are absolute URLs to the app.

export type MailBlock =
  | { kind: 'paragraph'; text: string }
  | { kind: 'button'; label: string; url: string }
  | { kind: 'list'; title: string; items: { text: string; url?: string; note?: string }[] }
  | { kind: 'small'; text: string };

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (char) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[char]!);
}

export function renderMail(heading: string, blocks: MailBlock[]): { text: string; html: string } {
  const text: string[] = [heading, ''];
  const html: string[] = [`<h1 style="font-size:20px;color:#8B5E3C;margin:0 0 16px">${escapeHtml(heading)}</h1>`];
  for (const block of blocks) {
    if (block.kind === 'paragraph' || block.kind === 'small') {
      text.push(block.text, '');
      const style = block.kind === 'small' ? 'font-size:12px;color:#555' : 'font-size:15px';
      html.push(`<p style="${style}">${escapeHtml(block.text)}</p>`);
    } else if (block.kind === 'button') {
      text.push(`${block.label}: ${block.url}`, '');
      html.push(
        `<p><a href="${escapeHtml(block.url)}" style="display:inline-block;padding:10px 18px;background:#8B5E3C;color:#fff;border-radius:6px;text-decoration:none">${escapeHtml(block.label)}</a></p>`,
        `<p style="font-size:12px;color:#555">Or open this address: ${escapeHtml(block.url)}</p>`,
      );
    } else {
      text.push(block.title);
      html.push(`<h2 style="font-size:16px;margin:16px 0 4px">${escapeHtml(block.title)}</h2>`);
      if (block.items.length === 0) {
        text.push('  (nothing)');
        html.push('<p style="color:#555">Nothing.</p>');
      } else {
        html.push('<ul>');
        for (const item of block.items) {
          text.push(`  - ${item.text}${item.url ? ` <${item.url}>` : ''}`);
          if (item.note) text.push(`    ${item.note}`);
          const label = item.url ? `<a href="${escapeHtml(item.url)}">${escapeHtml(item.text)}</a>` : escapeHtml(item.text);
          html.push(`<li>${label}${item.note ? `<br><small style="color:#555">${escapeHtml(item.note)}</small>` : ''}</li>`);
        }
        html.push('</ul>');
      }
      text.push('');
    }
  }
  text.push('-- ', 'Kerfcast');
  return {
    text: text.join('\n'),
    html: `<!doctype html><html><body style="font-family:Arial,Helvetica,sans-serif;color:#222;max-width:600px">${html.join('')}<p style="font-size:12px;color:#888">Kerfcast</p></body></html>`,
  };
}
