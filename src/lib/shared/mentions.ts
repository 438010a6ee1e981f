/**
 * @mentions in an inquiry's notes: `@` followed by a teammate's name as the firm knows it
 * (`@Sam Okafor`). The editor offers the names; the server reads the finished text against the
 * firm's own members only, so a name from anywhere else can never be mentioned.
 * Safe for islands and the server alike (no imports).
 */
export type Mentionable = { userId: string; name: string };

const LETTER_OR_DIGIT = /[\p{L}\p{N}]/u;

/**
 * The people a note mentions, each once, in the order of their first mention. A longer name wins
 * over a shorter one it starts with (`@Sam Okafor` over `@Sam`), and a name must end at a word's
 * end (`@Samantha` is not `@Sam`). Letter case does not matter.
 */
export function mentionedIn(text: string, people: readonly Mentionable[]): Mentionable[] {
  const byLength = [...people].filter((p) => p.name.trim()).sort((a, b) => b.name.length - a.name.length);
  const lower = text.toLocaleLowerCase();
  const found: { at: number; person: Mentionable }[] = [];
  const seen = new Set<string>();
  for (let at = lower.indexOf('@'); at !== -1; at = lower.indexOf('@', at + 1)) {
    // An e-mail address (someone@firm.test) is not a mention.
    if (at > 0 && LETTER_OR_DIGIT.test(text[at - 1]!)) continue;
    const person = byLength.find((p) => {
      const name = p.name.toLocaleLowerCase();
      if (!lower.startsWith(name, at + 1)) return false;
      const after = text[at + 1 + name.length];
      return after === undefined || !LETTER_OR_DIGIT.test(after);
    });
    if (person && !seen.has(person.userId)) {
      seen.add(person.userId);
      found.push({ at, person });
    }
  }
  return found.map((f) => f.person);
}

/**
 * The part of a name being typed after an `@` just before the caret, or null when the caret is
 * not in a mention ("Call @sa|" → "sa"). Used by the note editor to offer teammates.
 */
export function mentionQueryAt(text: string, caret: number): { start: number; query: string } | null {
  const before = text.slice(0, caret);
  const at = before.lastIndexOf('@');
  if (at === -1) return null;
  if (at > 0 && LETTER_OR_DIGIT.test(before[at - 1]!)) return null;
  const query = before.slice(at + 1);
  // Names have at most a few words; a line break or a long run ends the mention.
  if (query.includes('\n') || query.length > 40 || /\s\s/.test(query)) return null;
  return { start: at, query };
}
