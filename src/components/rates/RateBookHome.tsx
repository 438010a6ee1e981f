import '~/lib/shared/zod-in-browser';
import { useState } from 'react';
import { getJson } from '~/components/inquiries/page/api';
import { RATES_URL, type RatesOverview } from './draft-api';
import { DraftPanel } from './DraftPanel';
import { DraftEffects } from './DraftEffects';
import { VersionList } from './VersionList';

export type MoneyFormat = { currency: string; locale: string; timeZone: string };

type Props = MoneyFormat & {
  /** The firm's versions and draft as the page found them. */
  initial: RatesOverview;
};

/**
 * The Rate book's home (`/app/rates`): the published version, the draft with Publish and Discard,
 * what the draft would do to sample rooms and to recent inquiries, and every version to compare.
 */
export function RateBookHome({ initial, ...format }: Props) {
  const [overview, setOverview] = useState<RatesOverview>(initial);
  const reload = async () => setOverview(await getJson<RatesOverview>(RATES_URL));

  return (
    <div className="mt-4 space-y-8">
      <DraftPanel overview={overview} format={format} onChanged={reload} />
      {overview.draft && <DraftEffects key={`${overview.draft.id}:${overview.draft.revision}`} hasPublished={overview.published !== null} format={format} />}
      <VersionList overview={overview} format={format} onChanged={reload} />
    </div>
  );
}
