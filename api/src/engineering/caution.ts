/** Shown with every result that can drive a design. */
export const DESIGN_CAUTION =
  'Estimates from datasheet values: confirm by measurement and with the manufacturer before relying on them. ' +
  "Safety-relevant circuits follow their own standards and the organisation's qualification procedure.";
