import { Form, useNavigation } from "react-router";
import { z } from "zod";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import {
  getFourEyesPolicy,
  setFourEyesMode,
} from "~/.server/db/queries/settings";
import { badRequest, parseForm } from "~/.server/forms";
import {
  Button,
  FieldError,
  FormAlert,
  type FieldErrors,
} from "~/components/form";
import { PageHeader } from "~/components/page-header";
import {
  describeFourEyes,
  FOUR_EYES_AUTO_MIN_LAB_LEADS,
  FOUR_EYES_MODE_LABELS,
  FOUR_EYES_MODES,
} from "~/utils/four-eyes";
import type { Route } from "./+types/index";

const PolicySchema = z.object({
  fourEyes: z.enum(FOUR_EYES_MODES, {
    error: "Choose one of the three settings for four-eyes approval.",
  }),
});

export const meta: Route.MetaFunction = () => [
  { title: "Lab policy · Isopleth" },
];

export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "manage:settings");
  return { fourEyes: await getFourEyesPolicy() };
}

export async function action(args: Route.ActionArgs) {
  const me = requirePermission(args, "manage:settings");
  const { ipAddress } = getCaller(args);
  const form = await parseForm(args.request, PolicySchema);
  if (!form.ok)
    return badRequest({
      errors: form.errors,
      formError: "Nothing was changed.",
    });
  const result = await setFourEyesMode({
    mode: form.data.fourEyes,
    userId: me.id,
    ipAddress,
  });
  const now = describeFourEyes(await getFourEyesPolicy());
  return {
    errors: {} as FieldErrors,
    done: result.changed
      ? `Four-eyes approval is now: ${now}. The change is in the audit log.`
      : `Nothing to change: four-eyes approval is ${now}.`,
  };
}

export default function LabPolicy({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { fourEyes } = loaderData;
  const navigation = useNavigation();
  const done = actionData && "done" in actionData ? actionData.done : null;
  const formError =
    actionData && "formError" in actionData ? actionData.formError : null;
  const errors = actionData?.errors?.fourEyes;
  return (
    <>
      <PageHeader title="Lab policy">
        Rules the server applies to every lab lead and administrator.
      </PageHeader>
      <div className="space-y-3">
        <FormAlert message={done} tone="ok" />
        <FormAlert message={formError} />
      </div>
      <section
        className="mt-4 rounded-lg border border-line bg-panel p-5"
        aria-labelledby="four-eyes-heading"
      >
        <h2 id="four-eyes-heading" className="font-semibold">
          Four-eyes approval
        </h2>
        <p className="mt-1 text-sm text-ink-muted">
          When on, a revision must be approved by someone other than the person
          who uploaded it; the server refuses an uploader&apos;s own approval.
          Automatic turns it on when the installation has{" "}
          {FOUR_EYES_AUTO_MIN_LAB_LEADS} or more active lab leads (accounts with
          the lab lead role that are not disabled, counted at each approval;
          administrators are not counted).
        </p>
        <p className="mt-2 text-sm" data-testid="four-eyes-now">
          Now: <strong>{describeFourEyes(fourEyes)}</strong>
        </p>
        <Form method="post" className="mt-3 space-y-3">
          <fieldset
            aria-describedby={errors?.length ? "four-eyes-error" : undefined}
          >
            <legend className="sr-only">Four-eyes approval</legend>
            {FOUR_EYES_MODES.map((mode) => (
              <label
                key={mode}
                className="flex items-center gap-2 py-1 text-sm"
              >
                <input
                  type="radio"
                  name="fourEyes"
                  value={mode}
                  defaultChecked={fourEyes.mode === mode}
                />
                {FOUR_EYES_MODE_LABELS[mode]}
              </label>
            ))}
          </fieldset>
          <FieldError id="four-eyes-error" errors={errors} />
          <Button type="submit" disabled={navigation.state === "submitting"}>
            Save lab policy
          </Button>
        </Form>
      </section>
    </>
  );
}
