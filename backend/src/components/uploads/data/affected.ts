/** TypeORM's mysql driver returns the OkPacket for writes (an array [rows, packet] in some versions). */
export function affected(result: unknown): number {
  const r = result as { affectedRows?: number } | [unknown, { affectedRows?: number }];
  if (Array.isArray(r)) return Number((r[1] as { affectedRows?: number })?.affectedRows ?? 0);
  return Number(r?.affectedRows ?? 0);
}
