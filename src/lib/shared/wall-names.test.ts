import { describe, expect, it } from 'vitest';
import { listedWallNames, roomWallNames } from './wall-names.ts';

describe('wall names', () => {
  it('names the walls along the longer side "Long wall"', () => {
    expect(roomWallNames(96, 60)).toEqual(['Long wall 1', 'Short wall 1', 'Long wall 2', 'Short wall 2']);
    expect(roomWallNames(60, 96)).toEqual(['Short wall 1', 'Long wall 1', 'Short wall 2', 'Long wall 2']);
  });
  it('numbers the walls of a square room or one whose sizes are unknown', () => {
    expect(roomWallNames(120, 120)).toEqual(['Wall 1', 'Wall 2', 'Wall 3', 'Wall 4']);
    expect(roomWallNames(undefined, 120)[0]).toBe('Wall 1');
    expect(listedWallNames(2)).toEqual(['Wall 1', 'Wall 2']);
  });
});
