import { z } from "zod";

export const PASSWORD_MIN = 10;

export const emailSchema = z
  .email("enter a valid e-mail address")
  .max(254)
  .transform((s) => s.trim().toLowerCase());
export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN, `at least ${PASSWORD_MIN} characters`)
  .max(200, "at most 200 characters");

export const signupSchema = z.object({
  name: z.string().trim().min(1, "enter your name").max(120),
  email: emailSchema,
  password: passwordSchema,
  labName: z.string().trim().min(2, "at least 2 characters").max(120, "at most 120 characters"),
});
export type SignupInput = z.input<typeof signupSchema>;

export const loginSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, "enter your password"),
});

export const magicLinkSchema = z.object({ email: emailSchema });

/** `password` is the new account's, or the existing account's to confirm; none when signed in as the invitee. */
export const acceptInvitationSchema = z.object({
  name: z.string().trim().min(1, "enter your name").max(120).optional(),
  password: passwordSchema.optional(),
});

export const signupConfirmSchema = z.object({
  token: z.string().min(1, "the link's token is missing").max(200),
  password: z.string().min(1, "enter the password you chose when you signed up").max(200),
});

export const changePasswordSchema = z.object({
  currentPassword: z.string().min(1, "enter your current password").max(200),
  newPassword: passwordSchema,
});

/** How long a new API token lasts, days (the form's choices; 90 by default). No "never": see tokens.ts. */
export const TOKEN_LIFETIMES_DAYS = [30, 90, 365] as const;
export const DEFAULT_TOKEN_LIFETIME_DAYS = 90;

export const tokenCreateSchema = z.object({
  name: z.string().trim().min(1, "give the token a name").max(80, "at most 80 characters"),
  expiresInDays: z
    .number({ error: "“Expires after” must be a number of days: 30, 90 or 365" })
    .refine(
      (d) => (TOKEN_LIFETIMES_DAYS as readonly number[]).includes(d),
      "“Expires after” must be 30, 90 or 365 days",
    )
    .optional(),
});

/** Account settings; send only what changes. `name` is the display name others see. */
export const settingsSchema = z.object({
  notifyByEmail: z.boolean().optional(),
  name: z.string().trim().min(1, "enter the name others should see").max(120, "at most 120 characters").optional(),
});

/** "Forgot your password?": the address to send the link to. */
export const passwordResetRequestSchema = z.object({ email: emailSchema });

export const passwordResetSchema = z.object({
  token: z.string().min(1, "the link's token is missing").max(200),
  newPassword: passwordSchema,
});

export const emailChangeSchema = z.object({
  newEmail: emailSchema,
  currentPassword: z.string().min(1, "enter your current password").max(200),
});

export const emailChangeConfirmSchema = z.object({
  token: z.string().min(1, "the link's token is missing").max(200),
});
