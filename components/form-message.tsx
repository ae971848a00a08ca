export function FormMessage({ ok, errors, testId }: { ok?: string; errors?: string[]; testId?: string }) {
  if (errors?.length) {
    return (
      <p data-testid={testId ? `${testId}-error` : undefined} className="rounded-md border-2 border-verdict-fail bg-verdict-failbg px-3 py-2 text-sm font-semibold text-verdict-fail">
        <span aria-hidden="true">✕ </span>{errors[0]}
      </p>
    );
  }
  if (ok) {
    return (
      <p data-testid={testId ? `${testId}-ok` : undefined} className="rounded-md border-2 border-verdict-pass bg-verdict-passbg px-3 py-2 text-sm font-semibold text-verdict-pass">
        <span aria-hidden="true">● </span>{ok}
      </p>
    );
  }
  return null;
}
