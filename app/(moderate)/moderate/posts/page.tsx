import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { PostQueueView } from "@/components/qa/post-queue";
import { PageHeader } from "@/components/ui/page-header";
import { postQueue } from "@/db/queries/qa";
import { checkAccess } from "@/lib/auth/guard";
import { HIDE_AT_OPEN_FLAGS, TRUSTED_AFTER_APPROVED_POSTS } from "@/lib/qa/rules";
import { uploadImageOrigins } from "@/lib/uploads/origin";
import { approvePostAction, removePostAction, restorePostAction } from "./actions";

export const metadata: Metadata = { title: "Q&A moderation" };
export const dynamic = "force-dynamic";

export default async function PostModerationPage() {
  const access = await checkAccess(["moderator"]);
  if (!access.ok) return <AccessDenied decision={access} next="/moderate/posts" />;
  const initial = await postQueue();
  return (
    <div className="space-y-6" data-testid="post-moderation">
      <PageHeader
        eyebrow="Moderation"
        title="Q&A queue"
        lede={`A member's posts wait here until ${TRUSTED_AFTER_APPROVED_POSTS} of them are approved; a post with ${HIDE_AT_OPEN_FLAGS} open flags is hidden until you restore or remove it. Every decision is recorded in the audit log.`}
      />
      <PostQueueView initial={initial} imageOrigins={uploadImageOrigins()} actions={{ approve: approvePostAction, remove: removePostAction, restore: restorePostAction }} />
    </div>
  );
}
