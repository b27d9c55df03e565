/**
 * Every problem found in a JCAMP-DX file is reported as a JcampError naming the file, the 1-based
 * line and, where one applies, the label (field) at fault, so a user can open the file at the spot.
 */
export class JcampError extends Error {
  readonly file: string;
  readonly line: number;
  readonly field: string | undefined;

  constructor(file: string, line: number, message: string, field?: string) {
    super(`${file}:${line}: ${field ? `##${field}=: ` : ''}${message}`);
    this.name = 'JcampError';
    this.file = file;
    this.line = line;
    this.field = field;
  }
}
