/** The eight cell functions of the side checks (DESIGN.md's table), beside the seven lag functions. */
export const EXTRA_FUNCTIONS = [
  "SERIESVOLCHECK",
  "SERIESBIASCHECK",
  "SERIESFORECASTAUDIT",
  "SERIESBATCHCHECK",
  "SERIESCROSSCORR",
  "SERIESROLLCHECK",
  "SERIESRUNSCHECK",
  "SERIESNORMALCHECK",
] as const;
