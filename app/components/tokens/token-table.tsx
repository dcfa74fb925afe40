import { Form } from "react-router";
import { Button } from "~/components/form";

/** A token as the tokens page lists it (dates as ISO strings). */
export type TokenRow = {
  id: string;
  name: string;
  ownerEmail: string;
  scopes: string[];
  /** The fields and samples it is restricted to, by name; empty when it reaches everything readable. */
  restrictedTo: string[];
  expiresAt: string;
  lastUsedAt: string | null;
  revoked: boolean;
  expired: boolean;
  /** The reader may revoke it: their own, or anyone's with revoke:any-token, and not revoked yet. */
  mayRevoke: boolean;
};

/** The tokens the reader may see, each with a Revoke button where they may revoke it. */
export function TokenTable({
  tokens,
  seeAll,
}: {
  tokens: TokenRow[];
  /** The reader sees everyone's tokens: an Owner column is shown. */
  seeAll: boolean;
}) {
  return (
    <div className="relative mt-6 overflow-x-auto rounded-lg border border-line bg-panel">
      <table className="w-full text-sm">
        <caption className="sr-only">
          {seeAll ? "All API tokens" : "Your API tokens"}
        </caption>
        <thead className="bg-surface text-left text-ink-muted">
          <tr>
            <th className="px-3 py-2 font-semibold">Name</th>
            {seeAll ? <th className="px-3 py-2 font-semibold">Owner</th> : null}
            <th className="px-3 py-2 font-semibold">Scopes</th>
            <th className="px-3 py-2 font-semibold">Restricted to</th>
            <th className="px-3 py-2 font-semibold">Expires</th>
            <th className="px-3 py-2 font-semibold">Last used</th>
            <th className="px-3 py-2 font-semibold">Status</th>
            <th className="px-3 py-2">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {tokens.map((t) => (
            <tr key={t.id} className="border-t border-line">
              <td className="px-3 py-2 font-semibold">{t.name}</td>
              {seeAll ? <td className="px-3 py-2">{t.ownerEmail}</td> : null}
              <td className="px-3 py-2 font-mono text-xs">
                {t.scopes.join(" ")}
              </td>
              <td className="px-3 py-2">
                {t.restrictedTo.length
                  ? t.restrictedTo.join(", ")
                  : "everything readable"}
              </td>
              <td className="px-3 py-2 tabular-nums">
                {t.expiresAt.slice(0, 10)}
              </td>
              <td className="px-3 py-2 tabular-nums">
                {t.lastUsedAt
                  ? t.lastUsedAt.replace("T", " ").slice(0, 16)
                  : "never"}
              </td>
              <td className="px-3 py-2">
                {t.revoked ? (
                  <span className="text-danger">Revoked</span>
                ) : t.expired ? (
                  "Expired"
                ) : (
                  "Active"
                )}
              </td>
              <td className="px-3 py-2 text-right">
                {t.mayRevoke ? (
                  <Form method="post">
                    <input type="hidden" name="tokenId" value={t.id} />
                    <Button
                      type="submit"
                      name="intent"
                      value="revoke"
                      variant="danger"
                      className="px-2 py-1"
                      aria-label={`Revoke ${t.name}`}
                    >
                      Revoke
                    </Button>
                  </Form>
                ) : null}
              </td>
            </tr>
          ))}
          {tokens.length === 0 ? (
            <tr>
              <td colSpan={8} className="px-3 py-6 text-center text-ink-muted">
                No tokens yet.
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}
