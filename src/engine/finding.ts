/** One finding of a design: a failed limit, a warning near one, or information for the reader. */
export interface Finding {
  severity: 'fail' | 'warn' | 'info';
  code: string;
  message: string;
}
