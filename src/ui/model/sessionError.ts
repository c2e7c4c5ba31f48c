/** A user action the workbook refuses, with the reason in words the status line shows. */
export class SessionError extends Error {}
