/** Time from alert to verified repair, grouped per site or per who resolved it. Pure. */
import type { RepairTimeRow, VerificationStatus } from './alert-dto';

export interface RepairFact {
  key: string;
  label: string;
  verification: VerificationStatus | null;
  firstDetectedAt: Date;
  repairedAt: Date | null;
  verifiedAt: Date | null;
}

const DAY_MS = 86_400_000;

function median(values: number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

const days = (from: Date, to: Date) => Math.max(0, (to.getTime() - from.getTime()) / DAY_MS);
const round1 = (v: number | null) => (v === null ? null : Math.round(v * 10) / 10);

/** Rows sorted by label; days to verified count only repairs the data confirmed. */
export function repairTimes(facts: readonly RepairFact[]): RepairTimeRow[] {
  const groups = new Map<string, RepairFact[]>();
  for (const f of facts) groups.set(f.key, [...(groups.get(f.key) ?? []), f]);
  return [...groups.values()]
    .map((g) => {
      const verified = g.filter((f) => f.verification === 'verified' && f.verifiedAt);
      return {
        key: g[0]!.key,
        label: g[0]!.label,
        verified: verified.length,
        notVerified: g.filter((f) => f.verification === 'not-verified').length,
        watching: g.filter((f) => f.verification === 'watching').length,
        medianDaysToRepair: round1(
          median(g.filter((f) => f.repairedAt).map((f) => days(f.firstDetectedAt, f.repairedAt!))),
        ),
        medianDaysToVerified: round1(median(verified.map((f) => days(f.firstDetectedAt, f.verifiedAt!)))),
      };
    })
    .sort((a, b) => a.label.localeCompare(b.label));
}
