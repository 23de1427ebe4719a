import type { ReactElement } from "react";

/**
 * Every message the app sends through the outbox: its subject and its react-email template.
 * Templates register here so a queued row (template name + props) can be rendered by the worker.
 */
export type MailTemplate<P> = { subject: (props: P) => string; render: (props: P) => ReactElement };

const templates = new Map<string, MailTemplate<never>>();

export function defineMailTemplate<P>(name: string, template: MailTemplate<P>): { name: string; template: MailTemplate<P> } {
  templates.set(name, template as MailTemplate<never>);
  return { name, template };
}

export function mailTemplate(name: string): MailTemplate<Record<string, unknown>> | undefined {
  return templates.get(name) as MailTemplate<Record<string, unknown>> | undefined;
}
