/** The caution every view of follow-up reports carries: report, workbench and command line say the same. */
export const FOLLOW_UP_CAUTION =
  "Symptom reports are the person's own account (or a relative's, where shown), recorded as given. The times and courses derived from them are stated as reported; they are not measurements and not a diagnosis. Interpreting them is the clinician's task.";
