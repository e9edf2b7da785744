/**
 * The caution beside every list of probable causes (workspace, CLI, report.html), kept in one
 * place so every surface says the same thing.
 */
export const CAUSES_CAUTION =
  "Probable causes are engineering aids from recorded data: they support, but do not replace, the investigator's judgement and that of a licensed safety professional.";
