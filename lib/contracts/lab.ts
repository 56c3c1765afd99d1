import { z } from "zod";
import { ROLES } from "@/lib/access/roles";
import { emailSchema } from "./account";

export const roleSchema = z.enum(ROLES, "role must be one of manager, scientist, modeller, collaborator");

export const labCreateSchema = z.object({
  name: z.string().trim().min(2, "at least 2 characters").max(120, "at most 120 characters"),
});

export const invitationCreateSchema = z.object({
  email: emailSchema,
  role: roleSchema,
});

export const memberUpdateSchema = z.object({ role: roleSchema });
