import { z } from "zod";
import { OUTPUT_SYSTEMS } from "~/core/units";
import { labelSchema } from "./labels";
import { ROLES } from "./permissions";

/** Form schemas shared by the browser (checked before submitting) and the server (checked again in actions). */
export const MIN_PASSWORD_LENGTH = 10;

const email = z
  .string()
  .trim()
  .min(1, "Enter your e-mail address.")
  .max(254)
  .pipe(z.email("Enter a valid e-mail address."));
const newPassword = z
  .string()
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
  .max(200, "Use at most 200 characters.");
const name = labelSchema("name", 120, true, "Enter your name.");

export const SignInSchema = z.object({
  email,
  password: z.string().min(1, "Enter your password.").max(200),
  redirectTo: z.string().optional(),
});

export const ForgotPasswordSchema = z.object({ email });

export const NewPasswordSchema = z
  .object({ password: newPassword, confirm: z.string() })
  .refine((v) => v.password === v.confirm, {
    path: ["confirm"],
    message: "The two passwords differ.",
  });

export const AcceptInvitationSchema = z
  .object({ name, password: newPassword, confirm: z.string() })
  .refine((v) => v.password === v.confirm, {
    path: ["confirm"],
    message: "The two passwords differ.",
  });

export const ProfileSchema = z.object({
  intent: z.literal("profile"),
  name,
  unitSystem: z.enum(OUTPUT_SYSTEMS),
});

export const ChangePasswordSchema = z
  .object({
    intent: z.literal("password"),
    currentPassword: z.string().min(1, "Enter your current password."),
    password: newPassword,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, {
    path: ["confirm"],
    message: "The two passwords differ.",
  });

export const InviteSchema = z.object({
  intent: z.literal("invite"),
  email,
  role: z.enum(ROLES, "Choose a role."),
});

export const ChangeRoleSchema = z.object({
  intent: z.literal("role"),
  userId: z.coerce.number().int().positive(),
  role: z.enum(ROLES, "Choose a role."),
});

export const SetDisabledSchema = z.object({
  intent: z.enum(["disable", "enable"]),
  userId: z.coerce.number().int().positive(),
});
