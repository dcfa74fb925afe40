/** The caution shown wherever interpolated or extrapolated numbers may be relied on. */
export function EstimateCaution({ className = "" }: { className?: string }) {
  return (
    <p className={className} data-testid="estimate-caution">
      <strong className="font-semibold">Caution:</strong> interpolated and
      extrapolated properties are estimates. Check them against the laboratory
      report, and follow local regulations and licensed engineering practice for
      well control, facility design and reserves.
    </p>
  );
}
