import { z } from 'zod';

// OWASP ASVS 5.0 section 6.2: at least 8 characters, at least 64 allowed (we take 128),
// no composition rules, no truncation. The common-password check runs on the server.
export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 128;

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'That does not look like an e-mail address.' }))
  .transform((value) => value.toLowerCase());

export const passwordSchema = z
  .string({ error: 'Enter a password.' })
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
  .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters.`);

export const handleSchema = z
  .string({ error: 'Choose a handle.' })
  .trim()
  .toLowerCase()
  .min(3, 'Use at least 3 characters.')
  .max(32, 'Use at most 32 characters.')
  .regex(
    /^[a-z0-9][a-z0-9_-]*$/,
    'Use lower-case letters, digits, - and _, starting with a letter or digit.',
  );

export const displayNameSchema = z
  .string({ error: 'Enter the name other members will see.' })
  .trim()
  .min(1, 'Enter the name other members will see.')
  .max(80, 'Use at most 80 characters.');

export const tokenSchema = z
  .string({ error: 'The link is incomplete.' })
  .trim()
  .regex(/^[A-Za-z0-9_-]{22,128}$/, 'The link is incomplete or damaged.');

export const signUpSchema = z.object({
  email: emailSchema,
  displayName: displayNameSchema,
  handle: handleSchema,
  password: passwordSchema,
});

export const signInSchema = z.object({
  email: emailSchema,
  password: z
    .string({ error: 'Enter your password.' })
    .min(1, 'Enter your password.')
    .max(PASSWORD_MAX * 4),
});

export const verifySchema = z.object({ token: tokenSchema });
export const forgotPasswordSchema = z.object({ email: emailSchema });
export const resetPasswordSchema = z.object({ token: tokenSchema, password: passwordSchema });

export const changePasswordSchema = z.object({
  currentPassword: z
    .string({ error: 'Enter your current password.' })
    .min(1, 'Enter your current password.'),
  newPassword: passwordSchema,
});

export const updateMeSchema = z
  .object({
    displayName: displayNameSchema.optional(),
    units: z.enum(['metric', 'us'], { error: 'Choose metric or US customary.' }).optional(),
    remindersEnabled: z.boolean({ error: 'Choose on or off.' }).optional(),
    notifyComments: z.boolean({ error: 'Choose on or off.' }).optional(),
    bio: z.string().max(2000, 'Use at most 2000 characters.').optional(),
    email: emailSchema.optional(),
    currentPassword: z
      .string()
      .max(PASSWORD_MAX * 4)
      .optional(),
  })
  .refine((v) => !v.email || (v.currentPassword && v.currentPassword.length > 0), {
    message: 'Enter your current password to change your e-mail.',
    path: ['currentPassword'],
  });

export const deleteMeSchema = z.object({
  password: z
    .string({ error: 'Enter your password to confirm.' })
    .min(1, 'Enter your password to confirm.'),
});

export const adminUpdateUserSchema = z
  .object({
    role: z
      .enum(['member', 'moderator', 'admin'], { error: 'Choose member, moderator or admin.' })
      .optional(),
    disabled: z.boolean({ error: 'Choose enabled or disabled.' }).optional(),
  })
  .refine((v) => v.role !== undefined || v.disabled !== undefined, {
    message: 'Nothing to change.',
    path: ['_'],
  });

export const adminListUsersSchema = z.object({
  q: z.string().trim().max(100).optional(),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});

export type SignUpInput = z.infer<typeof signUpSchema>;
export type SignInInput = z.infer<typeof signInSchema>;
export type UpdateMeInput = z.infer<typeof updateMeSchema>;
