/**
 * Rillmark's local stand-in for a hosted weather feed, for development and tests. Plain HTTP + JSON, a shape
 * of Rillmark's own; all data invented (see invented-weather.ts). Nothing leaves the machine.
 *
 *   GET /status                                       → { "service": "rillmark-fake-weather", "ready": true }
 *   GET /daily-observations?lat=&lon=&from=&to=       → { "point": {lat, lon}, "units": {…}, "days": [ … ] }
 *
 * Dates are "YYYY-MM-DD", at most 800 days per request; a few days are deliberately missing.
 */
import { createServer, type Server } from 'node:http';
import { parseIsoDate } from '@shared/weather/day-of-year';
import { inventedDays } from './invented-weather';

const MAX_DAYS = 800;

function problem(status: number, message: string) {
  return { status, body: { problem: message } };
}

export function answer(url: URL): { status: number; body: unknown } {
  if (url.pathname === '/status') return { status: 200, body: { service: 'rillmark-fake-weather', ready: true } };
  if (url.pathname !== '/daily-observations') return problem(404, `no such path ${url.pathname}`);
  const lat = Number(url.searchParams.get('lat'));
  const lon = Number(url.searchParams.get('lon'));
  const from = url.searchParams.get('from') ?? '';
  const to = url.searchParams.get('to') ?? '';
  if (!url.searchParams.has('lat') || !(lat >= -90 && lat <= 90)) return problem(400, 'lat must be −90..90');
  if (!url.searchParams.has('lon') || !(lon >= -180 && lon <= 180)) return problem(400, 'lon must be −180..180');
  try {
    parseIsoDate(from);
    parseIsoDate(to);
  } catch (error) {
    return problem(400, (error as Error).message);
  }
  const span = (Date.parse(to) - Date.parse(from)) / 86_400_000 + 1;
  if (span < 1) return problem(400, 'to is before from');
  if (span > MAX_DAYS) return problem(400, `at most ${MAX_DAYS} days per request`);
  return {
    status: 200,
    body: {
      point: { lat, lon },
      units: { temperature: '°C', humidity: '%', wind: 'm/s at 2 m', solar: 'MJ/m²/day', rain: 'mm' },
      days: inventedDays(lat, lon, from, to, { withGaps: true }),
    },
  };
}

export function startFakeWeather(host: string, port: number): Promise<Server> {
  const server = createServer((req, res) => {
    const { status, body } =
      req.method === 'GET' ? answer(new URL(req.url ?? '/', `http://${host}`)) : problem(405, 'GET only');
    res.writeHead(status, { 'content-type': 'application/json' });
    res.end(JSON.stringify(body));
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve(server));
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const host = process.env['RILLMARK_FAKE_WEATHER_HOST'] ?? '127.0.0.1';
  const port = Number(process.env['RILLMARK_FAKE_WEATHER_PORT'] ?? 2590);
  const server = await startFakeWeather(host, port);
  console.log(`fake weather feed on http://${host}:${port}`);
  const stop = () => server.close(() => process.exit(0));
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}
