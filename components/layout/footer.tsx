export function ResearchCaution() {
  return (
    <footer className="mt-16 border-t border-rule px-6 py-5 text-xs leading-relaxed text-ink-soft">
      <p>
        <strong className="font-semibold text-ink">For research use only.</strong> Morphokin reports measurements with
        their uncertainties and model fits as hypotheses to test, not as measurements or diagnoses. Check every result
        against the original images before you rely on it.
      </p>
    </footer>
  );
}
