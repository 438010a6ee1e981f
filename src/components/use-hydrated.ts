import { useEffect, useState } from 'react';

/**
 * False in the server's HTML and until the island's effects have run. A button that only React can
 * act on stays disabled until then, so a click in the first moments is not silently lost.
 */
export function useHydrated(): boolean {
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);
  return hydrated;
}
