/** Fixed wording every brief carries, on screen, in print and in the e-mail. */
export const ESTIMATE_NOTICE =
  'Early estimate, not a design: these figures come from idealised models for early trade-off. They are not a quotation, a specification or a verified design.';

/** The safety caution of the product in one paragraph (the same words as SafetyCautionText). */
export const SAFETY_TEXT =
  'Caution — hazardous voltages. Off-line forward converters run from rectified mains and PFC buses at hundreds of volts. Isolation and creepage/clearance must follow the applicable safety standard (for example IEC 62368-1). Figures here are estimates for early trade-off only; a final design needs verification by qualified engineers and compliance with local codes.';

export const COST_NOTICE =
  'Power-stage BOM only, not a quote: the band is the parts of the power stage at the price tier for the stated annual volume, with the stated contingency.';
