import { createServer, type Server, type Socket } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../config';
import { DatabaseWatch } from './database-watch';

/** A port that accepts connections and never says a word, as a paused MariaDB does. */
let silent: Server;
const sockets: Socket[] = [];

beforeAll(async () => {
  silent = createServer((socket) => sockets.push(socket));
  await new Promise<void>((done) => silent.listen(0, '127.0.0.1', done));
});
afterAll(async () => {
  for (const s of sockets) s.destroy();
  await new Promise((done) => silent.close(done));
});

describe('database watch', () => {
  it('when one ping gets no answer, then requests are not turned away yet; after two in a row they are', async () => {
    const port = (silent.address() as { port: number }).port;
    const watch = new DatabaseWatch(loadConfig({ RILLMARK_DB_PORT: String(port) }).db);
    let told = 0;
    watch.onDown(() => told++);
    expect((await watch.check()).status).toBe('down');
    expect(watch.isDown).toBe(false);
    expect((await watch.check()).status).toBe('down');
    expect(watch.isDown).toBe(true);
    expect((await watch.check()).status).toBe('down');
    expect(told).toBe(1);
    await watch.stop();
  });
});
