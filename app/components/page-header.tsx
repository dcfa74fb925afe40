export function PageHeader({
  title,
  children,
}: {
  title: string;
  children?: React.ReactNode;
}) {
  return (
    <div className="mb-6">
      <h1 className="text-2xl font-bold tracking-tight">{title}</h1>
      {children ? (
        <div className="mt-1 max-w-3xl text-ink-muted">{children}</div>
      ) : null}
    </div>
  );
}
