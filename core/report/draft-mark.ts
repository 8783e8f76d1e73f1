/**
 * The draft mark: a report whose case has no sign-off in force (none recorded, or a
 * threshold changed after the last one; `currentSignOff`, core/case/overrides.ts) says so at
 * the top of every page, so a page printed or faxed alone cannot pass for a signed-off report.
 */
import type { AuditEntry, CaseFile } from '../case/case-file';
import { currentSignOff } from '../case/overrides';
import { WARN, type Layout } from './layout';

export const DRAFT_TEXT = 'DRAFT: no reviewer sign-off is in force for this case';

/** The sign-off entry that covers the case as reported, or null (then the report is a draft). */
export function signOffInForce(caseFile: Pick<CaseFile, 'log'>): AuditEntry | null {
  return currentSignOff(caseFile.log);
}

/** Why the report is a draft, in one sentence for the signature block. */
export function draftReason(caseFile: Pick<CaseFile, 'log'>): string {
  const last = [...caseFile.log].reverse().find((e) => e.action.kind === 'sign-off');
  return last
    ? `The sign-off in reviewer log entry ${last.seq} was followed by a threshold change, so it no longer covers what this report shows; a new sign-off is needed ('twofold sign-off CASE').`
    : "No sign-off statement is recorded in the reviewer log ('twofold sign-off CASE' records one).";
}

/** Draws the mark in the top margin of the current page (call once per page, after layout). */
export function drawDraftMark(L: Layout): void {
  const { doc } = L;
  const top = doc.page.margins.top;
  doc.page.margins.top = 0;
  const y = 16;
  doc.rect(L.left, y - 3, L.width, 15).lineWidth(0.8).strokeColor(WARN).stroke();
  doc.font(L.fonts.bold).fontSize(8.5).fillColor(WARN).text(DRAFT_TEXT, L.left, y, { width: L.width, align: 'center', lineBreak: false });
  doc.page.margins.top = top;
}
