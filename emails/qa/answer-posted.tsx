import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";
import { defineMailTemplate } from "../registry";

export type AnswerPostedProps = { askerName: string; answererName: string; questionTitle: string; questionUrl: string };

/** To the asker when an answer to their question becomes visible (posted by a trusted member, or approved). */
export const answerPostedMail = defineMailTemplate<AnswerPostedProps>("qa-answer-posted", {
  subject: (p) => `New answer: “${p.questionTitle}”`,
  render: (p) => (
    <EmailFrame preview={`${p.answererName} answered your question`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Your question has an answer</Text>
      <Text>Hello {p.askerName},</Text>
      <Text>
        {p.answererName} answered “{p.questionTitle}”. If it settles the question, mark it as the accepted answer so the next builder
        with the same trouble finds it first.
      </Text>
      <Text>
        Advice in the Q&amp;A comes from other builders. Before acting on it, disconnect the build from the mains and check with a meter
        that the bus capacitors are discharged.
      </Text>
      <Button href={p.questionUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Read the answer
      </Button>
    </EmailFrame>
  ),
});
