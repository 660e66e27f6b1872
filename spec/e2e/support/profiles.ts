/**
 * Waiting for the server's background profile fits: a fresh demo database fits every player × technique
 * in a worker thread after start-up, and lists (Squad week, the planner) answer `pending` until then.
 */
import { demoPeriod } from '../../../seed/calendar';

async function getJson<T>(baseUrl: string, token: string, path: string): Promise<T> {
  const res = await fetch(baseUrl + path, { headers: { Authorization: `Bearer ${token}` } });
  return (await res.json()) as T;
}

/** Resolves once no profile of the caller's squads is pending (polls the Squad week of the demo's last week). */
export async function profilesFitted(baseUrl: string, email: string, password = 'loftline-demo', timeoutMs = 150_000): Promise<void> {
  const login = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  const token = ((await login.json()) as { accessToken: string }).accessToken;
  const weekStart = demoPeriod(new Date()).weekStarts.at(-1)!.toISOString().slice(0, 10);
  const { squads } = await getJson<{ squads: { id: string }[] }>(baseUrl, token, '/api/squads');
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    let pending = 0;
    for (const squad of squads) {
      const week = await getJson<{ players: { reach: { pending: boolean }[]; calibrationPending: number }[] }>(
        baseUrl,
        token,
        `/api/squads/${squad.id}/week?start=${weekStart}`,
      );
      // Profiles, and the week's held-out calibrations the refresher computes after them.
      pending += week.players.reduce((n, p) => n + p.reach.filter((r) => r.pending).length + p.calibrationPending, 0);
    }
    if (pending === 0) return;
    if (Date.now() > deadline) throw new Error(`${pending} profiles still being fitted after ${timeoutMs / 1000} s`);
    await new Promise((done) => setTimeout(done, 1000));
  }
}
