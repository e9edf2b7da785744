import { startServer } from '../../tests/support/start-server';

/** A real Driftcase server with the demo seed for the browser benchmarks. */
export function startWebServer() {
  return startServer({ label: 'bench-web' });
}
