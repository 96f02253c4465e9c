import { loadSuite } from './load-suite';

// The short load run of `npm test`: 10 s. The 30-second run is tests/stress/load.stress.ts (`npm run test:stress`).
loadSuite({ seconds: 10, seed: 1, minRequests: 200 });
