import { z } from 'zod';

/**
 * JSON we store and read back later (a rate book's numbers, a lead's inputs, the estimate it was
 * shown) is written in an envelope that says which shape it has: `{ schemaVersion, data }`.
 * Reading parses the envelope, runs the upgrade steps from the stored version to the current one,
 * then validates the result with the current schema. Adding a field to a shape means: bump
 * `version`, add an upgrade step that fills the field for older data, and older rows keep loading.
 *
 * Rows written before envelopes existed hold the bare value; they count as version 0.
 */
export type Envelope<T> = { schemaVersion: number; data: T };

export type VersionedJson<T, In = T> = {
  /** The envelope to store for a value of the current shape. */
  wrap(value: In): Envelope<In>;
  /** The current shape of whatever was stored; throws StoredJsonError when it cannot be read. */
  read(stored: unknown): T;
  readonly version: number;
};

/** Stored JSON that no upgrade step or schema accepts: a bug or a damaged row, never user input. */
export class StoredJsonError extends Error {}

const envelopeSchema = z.object({ schemaVersion: z.number().int().min(1), data: z.unknown() });

export function versionedJson<T, In = T>(options: {
  /** What this is, for error messages ("lead estimate"). */
  name: string;
  /** The current version (1, 2, …). */
  version: number;
  /** Validates (and may normalise) data of the current version. */
  schema: z.ZodType<T, In>;
  /** `upgrades[n]` turns version-n data into version n+1; `upgrades[0]` reads pre-envelope rows. */
  upgrades: Record<number, (data: unknown) => unknown>;
}): VersionedJson<T, In> {
  const { name, version, schema, upgrades } = options;
  return {
    version,
    wrap: (value) => ({ schemaVersion: version, data: value }),
    read(stored) {
      const envelope = envelopeSchema.safeParse(stored);
      let from = envelope.success ? envelope.data.schemaVersion : 0;
      let data = envelope.success ? envelope.data.data : stored;
      if (from > version) throw new StoredJsonError(`${name}: stored version ${from} is newer than this program (${version}).`);
      for (; from < version; from++) {
        const step = upgrades[from];
        if (!step) throw new StoredJsonError(`${name}: no upgrade from version ${from}.`);
        data = step(data);
      }
      const parsed = schema.safeParse(data);
      if (!parsed.success) throw new StoredJsonError(`${name} (version ${version}) does not match its schema: ${parsed.error.message.slice(0, 500)}`);
      return parsed.data;
    },
  };
}
