// Sales channels. A cell that names none of the studio's channels becomes 'other' with one
// warning per distinct spelling, rather than an error: a typo in a channel should not block a
// year of sales, and the studio can add the channel and import again.

export const defaultChannels = ['market', 'booth', 'online', 'wholesale', 'consignment'] as const;

const channelSynonyms: Record<string, string> = {
  'craft fair': 'market',
  fair: 'market',
  'weekend market': 'market',
  'farmers market': 'market',
  'vendor mall': 'booth',
  stall: 'booth',
  'online shop': 'online',
  web: 'online',
  website: 'online',
  shop: 'online',
  'web shop': 'online',
  trade: 'wholesale',
  'on consignment': 'consignment',
};

function simplify(text: string): string {
  return text.toLowerCase().replace(/[^\p{L}\p{N}]+/gu, ' ').trim();
}

/** Maps a channel cell onto the studio's list; 'other' when it names none; null when blank. */
export function matchChannel(cell: string, channels: readonly string[]): string | null {
  const wanted = simplify(cell);
  if (wanted === '') return null;
  const own = channels.find((channel) => simplify(channel) === wanted);
  if (own !== undefined) return own;
  const synonym = channelSynonyms[wanted];
  const listed = synonym === undefined ? undefined : channels.find((channel) => simplify(channel) === synonym);
  return listed ?? 'other';
}
