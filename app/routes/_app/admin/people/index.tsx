import { Form, useNavigation } from "react-router";
import { inviteUser } from "~/.server/auth/accounts";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import {
  changeRole,
  setAccountDisabled,
  type PeopleOutcome,
} from "~/.server/auth/people";
import { listUsers } from "~/.server/db/queries/users";
import { badRequest, parseFormData, readFormData } from "~/.server/forms";
import { readIntent } from "~/utils/forms";
import {
  Button,
  FieldError,
  FormAlert,
  TextField,
  useZodForm,
} from "~/components/form";
import { PageHeader } from "~/components/page-header";
import {
  ChangeRoleSchema,
  InviteSchema,
  SetDisabledSchema,
} from "~/utils/auth-schemas";
import { ROLE_LABELS, ROLES } from "~/utils/permissions";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "People · Isopleth" }];

export async function loader(args: Route.LoaderArgs) {
  const me = requirePermission(args, "manage:people");
  return { me, people: await listUsers() };
}

export async function action(args: Route.ActionArgs) {
  const me = requirePermission(args, "manage:people");
  const { ipAddress } = getCaller(args);
  const formData = await readFormData(args.request);
  const intent = readIntent(formData);

  if (intent === "invite") {
    const form = parseFormData(formData, InviteSchema);
    if (!form.ok) return badRequest({ errors: form.errors, intent });
    const invited = await inviteUser({
      inviterId: me.id,
      inviterName: me.name,
      email: form.data.email,
      role: form.data.role,
      ipAddress,
    });
    if (!invited.ok)
      return badRequest({
        errors: { [invited.field]: [invited.message] },
        intent,
      });
    return {
      errors: {},
      intent,
      done: `Invitation sent to ${form.data.email}.`,
    };
  }

  if (intent === "role") {
    const form = parseFormData(formData, ChangeRoleSchema);
    if (!form.ok) return badRequest({ errors: form.errors, intent });
    const { userId, role } = form.data;
    return answer(
      intent,
      await changeRole({ actorId: me.id, userId, role, ipAddress }),
    );
  }

  const form = parseFormData(formData, SetDisabledSchema);
  if (!form.ok) return badRequest({ errors: form.errors, intent });
  const disabled = form.data.intent === "disable";
  return answer(
    intent,
    await setAccountDisabled({
      actorId: me.id,
      userId: form.data.userId,
      disabled,
      ipAddress,
    }),
  );
}

function answer(intent: string, outcome: PeopleOutcome) {
  if (!outcome.ok)
    return badRequest({ errors: {}, intent, formError: outcome.formError });
  return { errors: {}, intent, done: outcome.done };
}

export default function People({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { me, people } = loaderData;
  const navigation = useNavigation();
  const invite = useZodForm(
    InviteSchema,
    actionData?.intent === "invite" ? actionData.errors : null,
  );
  const done = actionData && "done" in actionData ? actionData.done : null;
  const formError =
    actionData && "formError" in actionData ? actionData.formError : null;
  return (
    <>
      <PageHeader title="People">
        Invite people, choose what each may do, and disable accounts that should
        no longer sign in.
      </PageHeader>
      <div className="space-y-3">
        <FormAlert message={done} tone="ok" />
        <FormAlert message={formError} />
      </div>
      <section className="mt-4 rounded-lg border border-line bg-panel p-5">
        <h2 className="font-semibold">Invite someone</h2>
        <Form
          method="post"
          className="mt-3 flex flex-wrap items-start gap-4"
          onSubmit={invite.onSubmit}
          noValidate
        >
          <input type="hidden" name="intent" value="invite" />
          <TextField
            label="E-mail address"
            name="email"
            type="email"
            required
            errors={invite.errors.email}
            className="min-w-64 flex-1"
          />
          <div>
            <label
              htmlFor="invite-role"
              className="block text-sm font-semibold"
            >
              Role
            </label>
            <select
              id="invite-role"
              name="role"
              defaultValue="engineer"
              className="mt-1 rounded border border-line bg-panel px-3 py-2 text-sm"
            >
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
            <FieldError errors={invite.errors.role} />
          </div>
          <Button
            type="submit"
            className="mt-6"
            disabled={navigation.state === "submitting"}
          >
            Send invitation
          </Button>
        </Form>
      </section>
      <div className="relative mt-6 overflow-x-auto rounded-lg border border-line bg-panel">
        <table className="w-full text-sm">
          <caption className="sr-only">People with an account</caption>
          <thead className="bg-surface text-left text-ink-muted">
            <tr>
              <th className="px-3 py-2 font-semibold">Name</th>
              <th className="px-3 py-2 font-semibold">E-mail</th>
              <th className="px-3 py-2 font-semibold">Role</th>
              <th className="px-3 py-2 font-semibold">Status</th>
              <th className="px-3 py-2 font-semibold">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {people.map((p) => (
              <tr key={p.id} className="border-t border-line">
                <td className="px-3 py-2 font-semibold">{p.name}</td>
                <td className="px-3 py-2">{p.email}</td>
                <td className="px-3 py-2">
                  <Form method="post" className="flex items-center gap-2">
                    <input type="hidden" name="intent" value="role" />
                    <input type="hidden" name="userId" value={p.id} />
                    <label className="sr-only" htmlFor={`role-${p.id}`}>
                      Role of {p.name}
                    </label>
                    <select
                      id={`role-${p.id}`}
                      name="role"
                      defaultValue={p.role}
                      className="rounded border border-line bg-panel px-2 py-1"
                    >
                      {ROLES.map((r) => (
                        <option key={r} value={r}>
                          {ROLE_LABELS[r]}
                        </option>
                      ))}
                    </select>
                    <Button
                      type="submit"
                      variant="secondary"
                      className="px-2 py-1"
                      aria-label={`Save role of ${p.name}`}
                    >
                      Save
                    </Button>
                  </Form>
                </td>
                <td className="px-3 py-2">
                  {p.disabledAt ? (
                    <span className="text-danger">Disabled</span>
                  ) : (
                    "Active"
                  )}
                </td>
                <td className="px-3 py-2 text-right">
                  {p.id !== me.id ? (
                    <Form method="post">
                      <input type="hidden" name="userId" value={p.id} />
                      <Button
                        type="submit"
                        name="intent"
                        value={p.disabledAt ? "enable" : "disable"}
                        variant={p.disabledAt ? "secondary" : "danger"}
                        className="px-2 py-1"
                        aria-label={`${p.disabledAt ? "Enable" : "Disable"} ${p.name}`}
                      >
                        {p.disabledAt ? "Enable" : "Disable"}
                      </Button>
                    </Form>
                  ) : (
                    <span className="text-xs text-ink-muted">you</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
