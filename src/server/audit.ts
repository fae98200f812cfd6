import { auditEvents } from '~/db/schema';
import type { Tx } from './db';

export interface AuditEntry {
  venueId: string | null;
  actorId: string | null;
  action: string;
  targetType: string;
  targetId?: string | null;
  detail?: Record<string, unknown>;
}

/** Written inside the same transaction as the change, so the log never disagrees with the data. */
export async function recordAudit(tx: Tx, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({ ...entry, targetId: entry.targetId ?? null, detail: entry.detail ?? null });
}
