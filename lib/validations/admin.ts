import { z } from "zod";
import { NUL_ERROR, NUL_FREE } from "./text";
import { ROLES } from "@/db/schema/users";

/** Roles an admin grants; everyone signed in is a member, so that one is not granted or revoked. */
export const GRANTABLE_ROLES = ROLES.filter((r) => r !== "member") as Exclude<(typeof ROLES)[number], "member">[];

export const roleChangeSchema = z.object({
  role: z.enum(GRANTABLE_ROLES as [string, ...string[]], { message: `must be one of ${GRANTABLE_ROLES.join(", ")}` }),
  grant: z.boolean({ message: "must be true (grant) or false (revoke)" }),
});

export type RoleChange = z.infer<typeof roleChangeSchema>;

export const userSearchSchema = z.object({ q: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(200, { error: "Keep the search under 200 characters." }).optional() });

/** A user id from a URL. Ids are text (Auth.js's random ids, the demo's readable ones), never NUL and never long. */
export const userIdSchema = z.string().regex(NUL_FREE).min(1).max(255);
