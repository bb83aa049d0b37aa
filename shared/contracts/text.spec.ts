import * as z from 'zod/mini';
import { isSafeName, isSafeNote, isWellFormed, safeName, safeNote } from './text';

const bmpOutsideSurrogates = Array.from({ length: 0x10000 }, (_, code) => code).filter((code) => code < 0xd800 || code > 0xdfff);

describe('names and notes a person may type', () => {
  it('when every character of the Basic Multilingual Plane is tried, then exactly the Unicode controls and bidi controls are refused in names', () => {
    // Outside source: the Unicode Character Database, General_Category=Cc (UnicodeData.txt) and
    // Bidi_Control (PropList.txt), as the JavaScript engine's \p{...} property escapes carry them.
    const unicodeSays = /[\p{Cc}\p{Bidi_Control}]/u;
    const disagreements = bmpOutsideSurrogates
      .map((code) => String.fromCharCode(code))
      .filter((char) => isSafeName(`a${char}b`) === unicodeSays.test(char));
    expect(disagreements.map((char) => char.charCodeAt(0).toString(16))).toEqual([]);
  });

  it('when every character is tried in a note, then only tab, line feed and carriage return are let through of those', () => {
    const unicodeSays = /[\p{Cc}\p{Bidi_Control}]/u;
    const allowedInNotes = new Set(['\t', '\n', '\r']);
    const disagreements = bmpOutsideSurrogates
      .map((code) => String.fromCharCode(code))
      .filter((char) => isSafeNote(`a${char}b`) === (unicodeSays.test(char) && !allowedInNotes.has(char)));
    expect(disagreements.map((char) => char.charCodeAt(0).toString(16))).toEqual([]);
  });

  it.each([
    ['a lone high surrogate', 'Anvil\uD83D', false],
    ['a lone low surrogate', '\uDE00Anvil', false],
    ['a low surrogate before a high one', 'a\uDE00\uD83Db', false],
    ['a whole emoji (a surrogate pair)', 'Anvil \uD83D\uDE00', true],
    ['plain letters', 'Quillmere', true],
    ['the empty text', '', true],
  ])('when the text has %s, then isWellFormed agrees with the WHATWG UTF-8 round trip', (_case, text, expected) => {
    // Outside source: the WHATWG Encoding Standard's UTF-8 encoder replaces a lone surrogate with U+FFFD.
    const roundTrip = new TextDecoder().decode(new TextEncoder().encode(text));
    expect(roundTrip === text).toBe(expected);
    expect(isWellFormed(text)).toBe(expected);
  });

  it.each([
    ['accented letters', true, 'Vélmorn Brönnhatt'],
    ['Hebrew letters', true, 'סדנת עץ'],
    ['Arabic letters', true, 'ورشة الخشب'],
    ['Japanese', true, '木工房ひのき'],
    ['an emoji', true, 'Spoon works 🥄'],
    ['a NUL', false, 'Spoon\u0000works'],
    ['a right-to-left override', false, 'invoice\u202Efdp.exe'],
    ['a first-strong isolate', false, 'Spoon\u2068works'],
    ['a right-to-left mark', false, 'Spoon\u200Fworks'],
    ['a line feed', false, 'Spoon\nworks'],
    ['a lone surrogate', false, 'Spoon\uD800works'],
  ])('when a name has %s, then isSafeName is %s', (_case, isAllowed, name) => {
    expect(isSafeName(name)).toBe(isAllowed);
  });

  it('when a schema uses the checks, then the message names the field and says what is wrong', () => {
    const studioName = z.string().check(z.trim(), ...safeName('Studio name'));
    expect(studioName.safeParse('Spoon\u202Eworks').error?.issues[0]?.message).toBe('Studio name contains a control or text-direction character');
    expect(studioName.safeParse('Spoon\uD800').error?.issues.map((issue) => issue.message)).toEqual([
      'Studio name contains a broken character (half of a surrogate pair)',
    ]);
    expect(studioName.parse('  Spoonworks  ')).toBe('Spoonworks');
    const notes = z.string().check(...safeNote('Notes'));
    expect(notes.parse('first line\r\n\tsecond line')).toBe('first line\r\n\tsecond line');
    expect(notes.safeParse('bell\u0007').success).toBe(false);
  });
});
