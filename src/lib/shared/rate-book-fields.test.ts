import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { rateBookSchema, sampleRateBook } from '~/lib/estimate';
import {
  appliesToTreatment,
  fieldAt,
  patternOf,
  RATE_BOOK_FIELDS,
  RATE_BOOK_GROUPS,
  RATE_BOOK_LISTS,
  RATE_BOOK_SECTIONS,
  rowFields,
  TREATMENT_KINDS,
} from './rate-book-fields';

/** Leaf paths of a plain object (list rows as their index), as patterns. */
function leavesOf(value: unknown, path: string[] = []): string[] {
  if (Array.isArray(value)) return value.flatMap((item, i) => leavesOf(item, [...path, String(i)]));
  if (value !== null && typeof value === 'object') return Object.entries(value).flatMap(([key, item]) => leavesOf(item, [...path, key]));
  return [patternOf(path)];
}

type Leaf = { pattern: string; kind?: string; from?: string };

/**
 * Leaf fields of a zod schema, read from its definition (zod 4's `_zod.def`), with the treatment kind
 * and shiplap source each belongs to. Wrappers (optional, default, transform pipes) are looked through.
 */
function schemaLeaves(schema: z.ZodType, path: string[] = [], ctx: { kind?: string; from?: string } = {}): Leaf[] {
  const def = (schema as unknown as { _zod: { def: Record<string, unknown> & { type: string } } })._zod.def;
  switch (def.type) {
    case 'optional':
    case 'default':
    case 'nullable':
      return schemaLeaves(def.innerType as z.ZodType, path, ctx);
    case 'pipe':
      return schemaLeaves(def.in as z.ZodType, path, ctx);
    case 'array':
      return schemaLeaves(def.element as z.ZodType, [...path, '*'], ctx);
    case 'object':
      return Object.entries(def.shape as Record<string, z.ZodType>).flatMap(([key, inner]) => schemaLeaves(inner, [...path, key], ctx));
    case 'union': {
      const key = def.discriminator as string;
      return (def.options as z.ZodType[]).flatMap((option) => {
        const shape = (option as unknown as { _zod: { def: { shape: Record<string, { _zod: { def: { values: string[] } } }> } } })._zod.def.shape;
        const value = shape[key]!._zod.def.values[0]!;
        return schemaLeaves(option, path, key === 'kind' ? { ...ctx, kind: value } : { ...ctx, from: value });
      });
    }
    default:
      return [{ pattern: path.join('.'), ...ctx }];
  }
}

const described = new Set(RATE_BOOK_FIELDS.map((f) => f.path));

describe('the Rate book field catalogue', () => {
  it('describes every leaf of the demo rate book', () => {
    const missing = [...new Set(leavesOf(sampleRateBook()))].filter((p) => !described.has(p));
    expect(missing).toEqual([]);
  });

  it('describes every field of the schema, and nothing the schema does not have', () => {
    const schemaPatterns = new Set(schemaLeaves(rateBookSchema).map((l) => l.pattern));
    expect([...schemaPatterns].filter((p) => !described.has(p))).toEqual([]);
    expect([...described].filter((p) => !schemaPatterns.has(p))).toEqual([]);
  });

  it('gives each treatment kind and shiplap source exactly the fields the schema gives it', () => {
    const leaves = schemaLeaves(rateBookSchema).filter((l) => l.pattern.startsWith('catalogue.treatments.*.'));
    for (const kind of TREATMENT_KINDS) {
      const sources = kind === 'shiplap' ? ['sheet', 'boards'] : [undefined];
      for (const from of sources) {
        const fromSchema = leaves.filter((l) => l.kind === kind && (l.from === undefined || l.from === from)).map((l) => l.pattern);
        const fromCatalogue = rowFields('catalogue.treatments')
          .filter((f) => appliesToTreatment(f, kind, from))
          .map((f) => f.path);
        expect(new Set(fromCatalogue), `${kind} ${from ?? ''}`).toEqual(new Set(fromSchema));
      }
    }
  });

  it('puts every field outside a list in exactly one section, and every top list in one', () => {
    const entries = RATE_BOOK_SECTIONS.flatMap((s) => s.entries);
    expect(new Set(entries).size).toBe(entries.length);
    const topLevel = RATE_BOOK_FIELDS.filter((f) => !f.path.includes('*')).map((f) => f.path);
    const topLists = RATE_BOOK_LISTS.filter((l) => !l.path.includes('*') && !RATE_BOOK_LISTS.some((o) => l.path.startsWith(`${o.path}.`))).map((l) => l.path);
    const nested = RATE_BOOK_LISTS.filter((l) => l.path.includes('*')).map((l) => l.path);
    // Nested lists (rows of mouldings) are shown inside their row; the others belong to a section.
    expect(new Set(entries)).toEqual(new Set([...topLevel, ...topLists.filter((p) => !nested.includes(p))]));
  });

  it('keeps the groups in the owner’s order and gives every field a label and help line', () => {
    expect(RATE_BOOK_GROUPS.map((g) => g.id)).toEqual(['materials', 'finishes', 'labour', 'extras', 'pricing', 'range', 'triage']);
    const order = RATE_BOOK_GROUPS.map((g) => g.id);
    const sectionOrder = RATE_BOOK_SECTIONS.map((s) => order.indexOf(s.group));
    expect(sectionOrder).toEqual([...sectionOrder].sort((a, b) => a - b));
    for (const field of RATE_BOOK_FIELDS) {
      expect(field.label, field.path).not.toBe('');
      expect(field.help, field.path).toMatch(/\.$/);
      if (field.kind === 'reference') expect(field.refersTo?.length, field.path).toBeGreaterThan(0);
      if (field.kind === 'choice') expect(field.options?.length, field.path).toBeGreaterThan(0);
    }
  });

  it('finds a field by the concrete path a form or the server names', () => {
    expect(fieldAt('catalogue.sheets.3.priceCents')?.kind).toBe('money');
    expect(fieldAt(['materialMarkup'])?.kind).toBe('percent');
    expect(fieldAt('catalogue.treatments.0.source.sheetId')?.refersTo).toEqual(['sheets']);
    expect(fieldAt('catalogue.sheets')).toBeUndefined();
  });
});
