/**
 * Every e-mail Lagwise sends, as data. A job carries one of these; the worker renders it
 * with its template at send time.
 */
export type OutgoingEmail =
  | { template: 'sign-in-link'; to: string; props: { signInUrl: string } }
  | {
      template: 'submission-confirmation';
      to: string;
      props: { signInUrl: string; assessmentId: string };
    }
  | { template: 'consultant-alert'; to: string; props: { assessmentId: string; consultantName: string; reopened?: boolean } }
  | { template: 'consultant-introduction'; to: string; props: { assessmentId: string; consultantUserId: string } };

export type EmailTemplateName = OutgoingEmail['template'];
