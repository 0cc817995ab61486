/** One problem with a weather input, named by field so a form or an upload row can point at it. */
export interface WeatherInputIssue {
  field: string;
  message: string;
}

/** Thrown when weather inputs are outside physical bounds; lists every problem found, not just the first. */
export class WeatherInputError extends RangeError {
  readonly issues: readonly WeatherInputIssue[];

  constructor(issues: WeatherInputIssue[]) {
    super(issues.map((issue) => `${issue.field}: ${issue.message}`).join('; '));
    this.name = 'WeatherInputError';
    this.issues = issues;
  }
}

/** Collects issues, then throws them together. */
export class IssueList {
  readonly issues: WeatherInputIssue[] = [];

  add(field: string, message: string): void {
    this.issues.push({ field, message });
  }

  /** Adds an issue unless `value` is a finite number within [min, max]. Skips undefined values. */
  checkRange(field: string, value: number | undefined, min: number, max: number, unit: string): void {
    if (value === undefined) return;
    if (!Number.isFinite(value)) this.add(field, `must be a number, got ${value}`);
    else if (value < min || value > max) this.add(field, `${value} ${unit} is outside ${min}..${max} ${unit}`);
  }

  throwIfAny(): void {
    if (this.issues.length > 0) throw new WeatherInputError(this.issues);
  }
}
