import { TextField } from "~/components/form";
import { MIN_PASSWORD_LENGTH } from "~/utils/auth-schemas";

/**
 * A new password and its confirmation (`password`, `confirm`), as every form that sets a password asks for
 * them: on accepting an invitation, resetting a forgotten password and changing it on the account page.
 */
export function NewPasswordFields({
  label,
  errors,
}: {
  /** "Password" or "New password"; the second field says "… again". */
  label: string;
  errors: { password?: string[]; confirm?: string[] };
}) {
  return (
    <>
      <TextField
        label={label}
        name="password"
        type="password"
        autoComplete="new-password"
        required
        errors={errors.password}
        hint={`At least ${MIN_PASSWORD_LENGTH} characters.`}
      />
      <TextField
        label={`${label} again`}
        name="confirm"
        type="password"
        autoComplete="new-password"
        required
        errors={errors.confirm}
      />
    </>
  );
}
