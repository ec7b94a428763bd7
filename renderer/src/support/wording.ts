/** Fixed wording shown on screen and in the printed report. */
export const CAUTION =
  "Planning estimates only — the aircraft's approved documents, local regulations and licensed practice take precedence. The reserve rule (by default a final reserve time at normal cruise) is common practice; local regulations set the rule that applies.";

export const CHECK_STATE_WORDS = { ok: 'OK', tight: 'Tight', fails: 'Fails' } as const;
export const CHECK_STATE_MARKS = { ok: '✓', tight: '!', fails: '✗' } as const;
