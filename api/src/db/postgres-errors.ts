/** Drizzle wraps driver errors; the PostgreSQL SQLSTATE sits on the error or its cause. */
export function sqlState(error: unknown): string | undefined {
  const candidate = error as { code?: unknown; cause?: { code?: unknown } };
  const code = candidate?.cause?.code ?? candidate?.code;
  return typeof code === 'string' ? code : undefined;
}

// PostgreSQL documentation, Appendix A "PostgreSQL Error Codes": 23505 unique_violation.
export const isUniqueViolation = (error: unknown) => sqlState(error) === '23505';
