/**
 * The first character that cannot be part of a SMILES: a control character (NUL, tab …), a character
 * outside ASCII (é, an emoji) or a space. Shared by the form's schema and the chemistry core, so both
 * name the same character at the same 1-based position. openchemlib would otherwise stop reading at
 * such a character and store what came before it as the molecule.
 */
export interface BadSmilesCharacter {
  /** 1-based position in the string (code points, so an emoji counts once). */
  position: number;
  codePoint: number;
  description: string;
}

export function firstBadSmilesCharacter(s: string): BadSmilesCharacter | null {
  let position = 0;
  for (const ch of s) {
    position++;
    const c = ch.codePointAt(0)!;
    if (c >= 0x21 && c <= 0x7e) continue;
    const hex = `U+${c.toString(16).toUpperCase().padStart(4, '0')}`;
    const description = c === 0x20 ? 'a space' : c < 0x20 || c === 0x7f ? `a control character (${hex})` : `"${ch}" (${hex}, not ASCII)`;
    return { position, codePoint: c, description };
  }
  return null;
}

/** For a zod `superRefine` on a SMILES field. A space is left to the parser, which tells a CXSMILES extension from a stray space. */
export function refineSmilesCharacters(s: string, ctx: { addIssue(issue: { code: 'custom'; message: string; params?: Record<string, unknown> }): void }): void {
  const bad = firstBadSmilesCharacter(s);
  if (bad && bad.codePoint !== 0x20) {
    ctx.addIssue({ code: 'custom', message: `Character ${bad.position} is ${bad.description}; a SMILES is printable ASCII without spaces.`, params: { position: bad.position } });
  }
}
