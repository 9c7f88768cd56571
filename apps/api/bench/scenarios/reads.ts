import { defineScenario } from '../scenario';

/** The owner's everyday reads: the request list, one request, the board's jobs. */
export default defineScenario({
  description: 'signed-in GET /api/projects, /api/projects/:id, /api/jobs (owner), 10 connections at 500 requests/s',
  connections: 10,
  overallRate: 500,
  target: { p99Ms: 20 },
  async setup({ signIn, getJson }) {
    const cookie = await signIn('maren@fernhill.example');
    const { projects } = await getJson<{ projects: { id: string }[] }>('/api/projects', cookie);
    if (!projects[0]) throw new Error('the demo seed has no projects');
    return {
      headers: { cookie },
      requests: [
        { method: 'GET', path: '/api/projects' },
        { method: 'GET', path: `/api/projects/${projects[0].id}` },
        { method: 'GET', path: '/api/jobs' },
      ],
    };
  },
});
