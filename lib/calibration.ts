/** A moment's date as the database stores calibration and test dates (YYYY-MM-DD, UTC). */
export function isoDateOf(moment: Date): string {
  return moment.toISOString().slice(0, 10);
}

export function isoDateToday(): string {
  return isoDateOf(new Date());
}

/**
 * Whether a calibration due on `calibrationDueOn` had run out by `on` (today unless given, e.g. a run's test date).
 * The due date itself still counts as calibrated.
 */
export function isCalibrationOverdue(calibrationDueOn: string, on: string = isoDateToday()): boolean {
  return calibrationDueOn < on;
}
