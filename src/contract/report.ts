/** POST /v1/reports without HTTP: the review report as one self-contained HTML page. */
import { renderReportPage } from '../render/report/report-page.js';
import { VERSION } from '../version.js';
import { SAFETY_CAUTION } from './caution.js';
import { reportModel } from './report-model.js';

export function reportHtml(body: unknown): string {
  return renderReportPage(reportModel(body), { version: VERSION, caution: SAFETY_CAUTION });
}
