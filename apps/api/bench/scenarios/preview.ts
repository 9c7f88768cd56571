import { designs } from '@benchwright/pricing';
import { defineScenario } from '../scenario';

/** The configurator's live preview of the standard rolling assembly bench, as an anonymous visitor asks for it. */
export default defineScenario({
  description: 'anonymous POST /api/quotes/preview of the standard assembly bench, 50 requests/s',
  connections: 5,
  overallRate: 50,
  target: { p99Ms: 100 },
  async setup() {
    return {
      requests: [
        {
          method: 'POST',
          path: '/api/quotes/preview',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ items: [{ spec: designs['assembly-bench'].defaults, quantity: 1 }] }),
        },
      ],
    };
  },
});
