import { describe, expect, test } from 'vitest';
import { mentionedIn, mentionQueryAt } from './mentions';

const sam = { userId: 'u-sam', name: 'Sam Okafor' };
const samantha = { userId: 'u-samantha', name: 'Samantha Reyes' };
const sa = { userId: 'u-sam-short', name: 'Sam' };
const rhea = { userId: 'u-rhea', name: 'Rhea Lindqvist' };
const people = [sam, samantha, sa, rhea];

// The rules below are our own syntax: common practice, no source.
describe('mentions in a note', () => {
  test('finds each named teammate once, in order, whatever the letter case', () => {
    expect(mentionedIn('@rhea lindqvist can you call? cc @Sam Okafor and again @Rhea Lindqvist', people)).toEqual([rhea, sam]);
  });

  test('the longest name wins, and a name must end where a word ends', () => {
    expect(mentionedIn('@Sam Okafor', people)).toEqual([sam]);
    expect(mentionedIn('@Sam, please', people)).toEqual([sa]);
    expect(mentionedIn('@Samantha Reyes.', people)).toEqual([samantha]);
    expect(mentionedIn('@Samanthax', people)).toEqual([]);
  });

  test('an e-mail address or a name outside the list is no mention', () => {
    expect(mentionedIn('write to sam@cedar-hollow.test', people)).toEqual([]);
    expect(mentionedIn('@Nora Beaumont should see this', people)).toEqual([]);
  });
});

describe('the name being typed after @', () => {
  test('is what lies between the @ and the caret', () => {
    expect(mentionQueryAt('Call @sa', 8)).toEqual({ start: 5, query: 'sa' });
    expect(mentionQueryAt('@', 1)).toEqual({ start: 0, query: '' });
    expect(mentionQueryAt('Ask @Sam Ok', 11)).toEqual({ start: 4, query: 'Sam Ok' });
  });

  test('is nothing outside a mention', () => {
    expect(mentionQueryAt('no mention here', 5)).toBeNull();
    expect(mentionQueryAt('mail sam@firm', 13)).toBeNull();
    expect(mentionQueryAt('@Sam\nnext line', 14)).toBeNull();
  });
});
