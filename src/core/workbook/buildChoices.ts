// The banks the workbook starts with: the compensation design's choice per bus.
export { choicesFromDesign, proposeChoices } from '../site/compensation.ts';
