/**
 * The audit worker: runs the numeric core off the main thread, exposed through comlink.
 * The page (to come, see DEVELOPERS.md) holds one controller that owns this worker.
 */
import * as Comlink from 'comlink';
import { runAudit, type AuditChoices, type AuditResult } from '../src/core/audit/index.js';

let cancelled = false;

export const auditApi = {
  run(sampleCsv: string, choices: AuditChoices, onProgress?: (done: number, total: number) => void): AuditResult {
    cancelled = false;
    return runAudit(sampleCsv, choices, { onProgress, isCancelled: () => cancelled });
  },
  cancel(): void {
    cancelled = true;
  },
};

export type AuditApi = typeof auditApi;

Comlink.expose(auditApi);
