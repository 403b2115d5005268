/** The safety caution carried by every analysis, report and gate answer. */
export const SAFETY_CAUTION =
  'This analysis supports, and never replaces, commissioning tests on the real equipment and the review required by local codes and licensed engineering practice. ' +
  'It holds only for the linear time-invariant model or data given, around one operating point.';
