import { z } from 'zod';

// Zod probes whether it may compile parsers with `new Function`; under our Content-Security-Policy
// (no 'unsafe-eval') the probe is refused and reported as a violation even though zod recovers.
// Islands import this once so the browser never makes the probe; the server (which renders the same
// islands) keeps the faster parsers.
if (typeof window !== 'undefined') z.config({ jitless: true });
