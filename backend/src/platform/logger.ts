/** A small leveled logger writing one line per event; enough until the product needs shipping logs. */
type Level = 'debug' | 'info' | 'warn' | 'error' | 'silent';
const ORDER: Record<Level, number> = { debug: 10, info: 20, warn: 30, error: 40, silent: 99 };

let threshold: Level = (process.env['RILLMARK_LOG_LEVEL'] as Level | undefined) ?? 'info';

export function setLogLevel(level: Level): void {
  threshold = level;
}

function write(level: Exclude<Level, 'silent'>, message: string, fields?: Record<string, unknown>): void {
  if (ORDER[level] < ORDER[threshold]) return;
  const extra = fields ? ' ' + JSON.stringify(fields) : '';
  const line = `${new Date().toISOString()} ${level.toUpperCase().padEnd(5)} ${message}${extra}`;
  (level === 'error' || level === 'warn' ? process.stderr : process.stdout).write(line + '\n');
}

export const logger = {
  debug: (m: string, f?: Record<string, unknown>) => write('debug', m, f),
  info: (m: string, f?: Record<string, unknown>) => write('info', m, f),
  warn: (m: string, f?: Record<string, unknown>) => write('warn', m, f),
  error: (m: string, f?: Record<string, unknown>) => write('error', m, f),
};
