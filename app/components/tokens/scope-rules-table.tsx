import { API_SCOPE_RULES } from "~/utils/api-scopes";

/** The one table of scope rules (app/utils/api-scopes.ts), as the API enforces it. */
export function ScopeRulesTable() {
  return (
    <div className="relative mt-6 overflow-x-auto rounded-lg border border-line bg-panel">
      <table className="w-full text-sm">
        <caption className="px-3 pt-3 text-left font-semibold">
          What each scope allows
        </caption>
        <thead className="text-left text-ink-muted">
          <tr>
            <th className="px-3 py-2 font-semibold">Request</th>
            <th className="px-3 py-2 font-semibold">Token needs the scope</th>
            <th className="px-3 py-2 font-semibold">Owner&apos;s role needs</th>
            <th className="px-3 py-2 font-semibold">What it gives</th>
          </tr>
        </thead>
        <tbody>
          {API_SCOPE_RULES.map((rule) => (
            <tr key={rule.operation} className="border-t border-line">
              <td className="px-3 py-2 font-mono text-xs">
                {rule.method} {rule.path}
              </td>
              <td className="px-3 py-2 font-mono text-xs">
                {rule.scopes.join(" or ")}
              </td>
              <td className="px-3 py-2 font-mono text-xs">{rule.permission}</td>
              <td className="px-3 py-2">{rule.description}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="px-3 pb-3 text-xs text-ink-muted">
        The role is checked on every request: if the owner&apos;s role changes,
        existing tokens follow at once. Tokens read approved revisions only.
      </p>
    </div>
  );
}
