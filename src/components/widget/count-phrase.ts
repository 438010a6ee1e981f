/** "2 windows", "1 light switch": a counter's value said with its item, for screen readers. */
export function countPhrase(count: number, pluralLabel: string): string {
  const plural = pluralLabel.toLowerCase();
  return `${count} ${count === 1 ? singular(plural) : plural}`;
}

// Enough for the widget's own labels: "-ches", "-shes", "-xes", "-sses" drop "es"; others drop "s".
function singular(plural: string): string {
  if (/(ch|sh|x|ss)es$/.test(plural)) return plural.slice(0, -2);
  return plural.endsWith('s') ? plural.slice(0, -1) : plural;
}
