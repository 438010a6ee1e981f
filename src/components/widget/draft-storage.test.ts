import { describe, expect, it } from 'vitest';
import {
  chooseFormToken,
  clearDraft,
  DRAFT_STORAGE_VERSION,
  draftStorageKey,
  formTokenIssuedAt,
  loadDraft,
  rekey,
  saveDraft,
  type SavedWidget,
} from './draft-storage';

// Source: docs/sources.md §61 (WHATWG HTML, Web storage: a string store per origin and tab that
// survives a reload; setItem may throw when the quota is used up; getItem gives null for a missing key).

/** A Storage stand-in with the behaviour the standard describes. */
function memoryStorage(failOnWrite = false): Storage {
  const map = new Map<string, string>();
  return {
    get length() {
      return map.size;
    },
    clear: () => map.clear(),
    getItem: (key) => map.get(key) ?? null,
    key: (i) => [...map.keys()][i] ?? null,
    removeItem: (key) => void map.delete(key),
    setItem: (key, value) => {
      if (failOnWrite) throw new DOMException('full', 'QuotaExceededError');
      map.set(key, String(value));
    },
  };
}

const token = (issuedAt: number) => `${Buffer.from(JSON.stringify({ c: 'firm', d: 'draft-1', t: issuedAt })).toString('base64url')}.signature`;
const HOUR = 3_600_000;
const now = Date.UTC(2026, 11, 3, 9);

const saved = (over: Partial<SavedWidget> = {}): SavedWidget => ({
  slug: 'cedar-hollow',
  units: 'imperial',
  formToken: token(now - HOUR),
  step: 2,
  draft: { rooms: [{ key: 'k1', name: 'Bathroom', walls: [{ key: 'k2' }] }], treatmentId: 'shiplap' },
  photos: [{ id: 'p1', name: 'tub wall.jpg', thumbnailUrl: 'https://photos.test/p1.jpg' }],
  idempotencyKey: 'send-1',
  ...over,
});

describe('keeping the widget across a reload', () => {
  it('gives back what was saved for the same firm', () => {
    const storage = memoryStorage();
    saveDraft(storage, saved(), now);
    const back = loadDraft(storage, 'cedar-hollow', 'imperial');
    expect(back?.draft).toEqual(saved().draft);
    expect(back?.step).toBe(2);
    expect(back?.photos).toEqual(saved().photos);
    expect(back?.formToken).toBe(saved().formToken);
    expect(back?.idempotencyKey).toBe('send-1');
  });

  it('keeps one firm’s draft away from another’s', () => {
    const storage = memoryStorage();
    saveDraft(storage, saved(), now);
    expect(loadDraft(storage, 'northgate', 'imperial')).toBeNull();
    expect(draftStorageKey('cedar-hollow')).not.toBe(draftStorageKey('northgate'));
  });

  it('forgets the draft after Send', () => {
    const storage = memoryStorage();
    saveDraft(storage, saved(), now);
    clearDraft(storage, 'cedar-hollow');
    expect(loadDraft(storage, 'cedar-hollow', 'imperial')).toBeNull();
  });

  it('ignores junk, another version, a draft without rooms, and a firm that changed its units', () => {
    const storage = memoryStorage();
    const key = draftStorageKey('cedar-hollow');
    for (const junk of [
      '{',
      'null',
      '42',
      '[]',
      JSON.stringify({ version: 99, ...saved() }),
      JSON.stringify({ version: DRAFT_STORAGE_VERSION, ...saved(), draft: { rooms: 'x' } }),
    ]) {
      storage.setItem(key, junk);
      expect(loadDraft(storage, 'cedar-hollow', 'imperial')).toBeNull();
    }
    saveDraft(storage, saved(), now);
    expect(loadDraft(storage, 'cedar-hollow', 'metric')).toBeNull();
  });

  it('drops photo entries that are not whole, keeping the rest', () => {
    const storage = memoryStorage();
    storage.setItem(
      draftStorageKey('cedar-hollow'),
      JSON.stringify({
        version: DRAFT_STORAGE_VERSION,
        ...saved(),
        photos: [{ id: 'p1', name: 'a.jpg', thumbnailUrl: 'https://photos.test/a.jpg' }, { id: 3 }, 'x'],
      }),
    );
    expect(loadDraft(storage, 'cedar-hollow', 'imperial')?.photos).toEqual([{ id: 'p1', name: 'a.jpg', thumbnailUrl: 'https://photos.test/a.jpg' }]);
  });

  it('works without storage at all, and when storage refuses to write', () => {
    expect(() => saveDraft(null, saved(), now)).not.toThrow();
    expect(loadDraft(null, 'cedar-hollow', 'imperial')).toBeNull();
    expect(() => saveDraft(memoryStorage(true), saved(), now)).not.toThrow();
  });
});

describe('which form token a restored draft uses', () => {
  const TTL = 24 * HOUR;

  it('reads when a token was issued, and nothing from junk', () => {
    expect(formTokenIssuedAt(token(now))).toBe(now);
    expect(formTokenIssuedAt('not a token')).toBeNull();
    expect(formTokenIssuedAt('e30.sig')).toBeNull(); // "{}"
  });

  it('keeps the saved token while it has time left, so the photos uploaded under it stay with the inquiry', () => {
    expect(chooseFormToken(token(now - 2 * HOUR), 'fresh', TTL, now)).toEqual({ formToken: token(now - 2 * HOUR), kept: true });
  });

  it('takes the new token when the saved one is about to run out (less than an hour left) or cannot be read', () => {
    expect(chooseFormToken(token(now - 23.5 * HOUR), 'fresh', TTL, now)).toEqual({ formToken: 'fresh', kept: false });
    expect(chooseFormToken('junk', 'fresh', TTL, now)).toEqual({ formToken: 'fresh', kept: false });
    expect(chooseFormToken(null, 'fresh', TTL, now)).toEqual({ formToken: 'fresh', kept: false });
  });
});

describe('rekey', () => {
  it('gives every list key a new value, so restored rooms never share a key with new ones', () => {
    let n = 100;
    const draft = { rooms: [{ key: 'k1', name: 'x', walls: [{ key: 'k2', length: '' }] }], key: 'k3' };
    const out = rekey(draft, () => `k${++n}`);
    expect(out).toEqual({ rooms: [{ key: 'k102', name: 'x', walls: [{ key: 'k103', length: '' }] }], key: 'k101' });
  });
});
