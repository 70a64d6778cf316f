// `npm run db:seed` (the start and test commands run it): loads the demo scenario idempotently.
import { seedDemo } from './seed/load.ts';

await seedDemo();
