import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";
import { defineMailTemplate } from "../registry";

export type PostRemovedProps = { authorName: string; kind: "question" | "answer"; questionTitle: string; reason: string; questionUrl: string };

/** To the author of a question or answer a moderator removed, with the moderator's reason. */
export const postRemovedMail = defineMailTemplate<PostRemovedProps>("qa-post-removed", {
  subject: (p) => (p.kind === "question" ? `Removed: your question “${p.questionTitle}”` : `Removed: your answer to “${p.questionTitle}”`),
  render: (p) => (
    <EmailFrame preview="A moderator removed your post">
      <Text style={{ fontSize: 18, fontWeight: 700 }}>A moderator removed your {p.kind}</Text>
      <Text>Hello {p.authorName},</Text>
      <Text>
        {p.kind === "question" ? `Your question “${p.questionTitle}”` : `Your answer to “${p.questionTitle}”`} is no longer shown in the
        Q&amp;A. The moderator gave this reason:
      </Text>
      <Text style={{ borderLeft: `3px solid ${emailColours.rule}`, paddingLeft: 10 }}>{p.reason}</Text>
      <Text>You can still read the post and the reason on its page; nobody else sees it.</Text>
      <Button href={p.questionUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Open the question
      </Button>
    </EmailFrame>
  ),
});
