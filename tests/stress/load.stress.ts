import { loadSuite } from './load-suite';

// `npm run test:stress`: the 30-second load run.
loadSuite({ seconds: 30, seed: 2 });
