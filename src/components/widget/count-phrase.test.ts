import { describe, expect, it } from 'vitest';
import { countPhrase } from './count-phrase.ts';

// English plurals for the counters' own labels (common practice, no source); the issue's example "2 windows".
describe('countPhrase: what a counter announces', () => {
  it.each([
    [2, 'Windows', '2 windows'],
    [1, 'Windows', '1 window'],
    [0, 'Doors', '0 doors'],
    [1, 'Doors', '1 door'],
    [1, 'Light switches', '1 light switch'],
    [3, 'Light switches', '3 light switches'],
    [1, 'Outlets', '1 outlet'],
    [1, 'Boxes', '1 box'],
  ])('%d %s → %s', (n, label, phrase) => {
    expect(countPhrase(n, label)).toBe(phrase);
  });
});
