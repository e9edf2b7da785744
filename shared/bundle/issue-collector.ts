import type { BundleIssue } from './types';

/** A bundle with a broken column can have a million bad rows; past this many we only count them. */
export const MAX_REPORTED_ISSUES = 200;

/**
 * Collects validation issues up to a limit, counting (not storing) the rest so one bad file
 * cannot flood memory or the report. `finish()` appends a single "...and N more" line.
 */
export class IssueCollector {
  private readonly kept: BundleIssue[] = [];
  private droppedErrors = 0;
  private droppedWarnings = 0;
  private keptErrors = 0;

  constructor(private readonly limit = MAX_REPORTED_ISSUES) {}

  add(issue: BundleIssue): void {
    const isWarning = issue.severity === 'warning';
    if (this.kept.length < this.limit) {
      this.kept.push(issue);
      if (!isWarning) this.keptErrors++;
    } else if (isWarning) {
      this.droppedWarnings++;
    } else {
      this.droppedErrors++;
    }
  }

  get errorCount(): number {
    return this.keptErrors + this.droppedErrors;
  }

  hasErrors(): boolean {
    return this.errorCount > 0;
  }

  /** The kept issues, plus one summary issue when some were dropped. */
  finish(): BundleIssue[] {
    const dropped = this.droppedErrors + this.droppedWarnings;
    if (dropped === 0) return [...this.kept];
    const summary: BundleIssue = {
      file: '(bundle)',
      message: `...and ${dropped} more issue${dropped === 1 ? '' : 's'} not listed (${this.droppedErrors} errors, ${this.droppedWarnings} warnings)`,
    };
    if (this.droppedErrors === 0) summary.severity = 'warning';
    return [...this.kept, summary];
  }
}
