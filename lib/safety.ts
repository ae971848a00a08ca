// The caution shown beside every calculator and on the traveller; one wording for screen and paper.
export const SAFETY_NOTE =
  "Results support, and never replace, the vehicle maker's specifications, local codes and qualified or licensed practice.";
