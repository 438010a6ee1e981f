/**
 * The placeholders of the firm's e-mail templates: a word in braces, `{name}`, replaced when the
 * e-mail is sent. Our own small syntax, documented on the template screen from `PLACEHOLDERS`.
 * Safe for islands and the server alike (no imports).
 */
export const PLACEHOLDERS = [
  { key: 'name', means: 'the homeowner’s name' },
  { key: 'firm', means: 'your firm’s name' },
  { key: 'reference', means: 'the inquiry’s reference' },
  { key: 'range', means: 'the price range the homeowner was shown' },
  { key: 'estimate_link', means: 'a private link to the homeowner’s estimate, made when the e-mail is sent' },
  { key: 'sender', means: 'the name of the person sending it' },
  { key: 'firm_phone', means: 'your firm’s phone number' },
] as const;

export type PlaceholderKey = (typeof PLACEHOLDERS)[number]['key'];
export type PlaceholderValues = Record<PlaceholderKey, string>;

const KNOWN = new Set<string>(PLACEHOLDERS.map((p) => p.key));
const WORD_IN_BRACES = /\{([a-z_]+)\}/g;

/** The words in braces a text uses that are not placeholders (a typo like `{nmae}`), each once. */
export function unknownPlaceholders(text: string): string[] {
  const unknown = new Set<string>();
  for (const [, key] of text.matchAll(WORD_IN_BRACES)) if (!KNOWN.has(key!)) unknown.add(key!);
  return [...unknown];
}

/**
 * Fills a template's placeholders. Keys not given are left as they are (the inquiry page fills
 * everything but `{estimate_link}`, which exists only once the e-mail is sent). A line left ending
 * in a separator because its last value was empty (`{firm} · {firm_phone}` without a phone) loses it.
 */
export function fillPlaceholders(text: string, values: Partial<PlaceholderValues>): string {
  const filled = text.replace(WORD_IN_BRACES, (whole, key: string) => {
    const value = (values as Record<string, string | undefined>)[key];
    return value === undefined ? whole : value;
  });
  return filled
    .split('\n')
    .map((line) => line.replace(/\s+[·|,-]\s*$/, ''))
    .join('\n');
}
