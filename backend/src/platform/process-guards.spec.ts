import { EventEmitter } from 'node:events';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { EXIT, installProcessGuards } from './process-guards';

function fakeProcess() {
  const emitter = new EventEmitter();
  const exit = vi.fn();
  return { proc: Object.assign(emitter, { exit: exit as unknown as (code: number) => never }), exit };
}

afterEach(() => vi.restoreAllMocks());

describe('process guards', () => {
  it('when a promise is rejected with nobody listening, then it is logged and the process keeps running', () => {
    const lines: string[] = [];
    vi.spyOn(process.stderr, 'write').mockImplementation((chunk) => (lines.push(String(chunk)), true));
    const { proc, exit } = fakeProcess();
    installProcessGuards(proc);
    proc.emit('unhandledRejection', new Error('lost promise'));
    expect(exit).not.toHaveBeenCalled();
    expect(lines.join('')).toMatch(/ERROR unhandled promise rejection .*lost promise/);
  });

  it('when an exception is not caught, then it is logged and the process exits for its supervisor', () => {
    const lines: string[] = [];
    vi.spyOn(process.stderr, 'write').mockImplementation((chunk) => (lines.push(String(chunk)), true));
    const { proc, exit } = fakeProcess();
    installProcessGuards(proc);
    proc.emit('uncaughtException', new Error('broken state'));
    expect(exit).toHaveBeenCalledWith(EXIT.crashed);
    expect(lines.join('')).toMatch(/ERROR uncaught exception: exiting .*broken state/);
  });
});
