import { defineScenario } from '../scenario';

/**
 * The owner's list at 10,000 projects (the scale seed: 200 clients, 100,000 timeline events, every status): the
 * first page, a page filtered by status, and a search of clients and notes, each on its own for 20 s.
 */
export default defineScenario({
  description:
    'owner GET /api/projects at 10,000 projects: first page, status filter, search; 10 connections at 100 requests/s',
  connections: 10,
  overallRate: 100,
  target: { p99Ms: 50 },
  scale: 10_000,
  async setup({ signIn, getJson }) {
    const cookie = await signIn('maren@fernhill.example');
    const { projects } = await getJson<{ projects: unknown[] }>('/api/projects?status=estimate_sent', cookie);
    if (projects.length < 50) throw new Error('the scale seed is missing: fewer than 50 estimates out');
    return {
      headers: { cookie },
      parts: [
        { label: 'first page', requests: [{ method: 'GET', path: '/api/projects' }] },
        { label: 'filtered page', requests: [{ method: 'GET', path: '/api/projects?status=estimate_sent' }] },
        { label: 'search', requests: [{ method: 'GET', path: '/api/projects?q=laundry' }] },
      ],
    };
  },
});
