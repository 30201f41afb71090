// Schemas for sign-up and sign-in, shared by the forms and the route handlers.
import { z } from "zod";

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: "Enter a valid e-mail address." }));

export const passwordSchema = z
  .string()
  .min(10, { message: "Use at least 10 characters." })
  .max(200, { message: "Use at most 200 characters." });

export const signUpSchema = z.object({
  email: emailSchema,
  password: passwordSchema,
  name: z.string().trim().min(1, { message: "Enter your name." }).max(100),
  teamName: z.string().trim().min(1, { message: "Name your team." }).max(100),
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, { message: "Enter your password." }).max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;
