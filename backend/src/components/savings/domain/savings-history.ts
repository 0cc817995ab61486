import type { AuditTrailEntry } from '../../audit/data/audit-repository';
import { SAVINGS_FIELD_LABELS, type SavingsHistoryEntryDto } from '@shared/savings/savings-project-dto';

const ACTIONS: Record<string, string> = {
  create: 'Created the project',
  update: 'Changed the project',
  'baseline-change': 'Changed the locked baseline',
  installed: 'Marked installed: baseline and model locked',
  archive: 'Archived the project',
  restore: 'Restored the project',
  delete: 'Deleted the project',
};

/** One audit entry of a savings project in plain words: what happened, each changed field, and the reason given. */
export function historyEntry(entry: AuditTrailEntry): SavingsHistoryEntryDto {
  const changes = (entry.changes ?? {}) as Record<string, unknown>;
  const lines: string[] = [];
  if (entry.action === 'update' || entry.action === 'baseline-change') {
    for (const [field, change] of Object.entries(changes)) {
      if (field === 'reason' || !Array.isArray(change)) continue;
      lines.push(`${SAVINGS_FIELD_LABELS[field] ?? field}: ${show(change[0])} → ${show(change[1])}`);
    }
  }
  return {
    at: entry.at,
    userName: entry.userName ?? 'Former user',
    action: ACTIONS[entry.action] ?? entry.action,
    lines,
    reason: typeof changes['reason'] === 'string' ? changes['reason'] : null,
  };
}

function show(value: unknown): string {
  if (value === null || value === undefined || value === '') return '(none)';
  if (Array.isArray(value)) return value.length ? value.join('; ') : '(none)';
  return String(value);
}
