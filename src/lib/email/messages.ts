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
  | { template: 'consultant-introduction'; to: string; props: { assessmentId: string; consultantUserId: string } }
  | {
      template: 'consultant-invitation';
      to: string;
      props: { name: string; firm: string; invitedByName: string; inviteUrl: string; expiresAt: string };
    }
  | { template: 'password-reset'; to: string; props: { name: string; resetUrl: string } }
  | { template: 'admin-unrouted'; to: string; props: { adminName: string; assessmentId: string } }
  | {
      template: 'admin-stale-digest';
      to: string;
      props: {
        adminName: string;
        staleAfterHours: number;
        leads: { id: string; reference: string; regionName: string; waitingHours: number }[];
        more: number;
      };
    }
  | { template: 'lead-assigned'; to: string; props: { assessmentId: string; consultantName: string; reason: string } }
  /** To the owner: a report version is out, with its link and the PDF attached. */
  | { template: 'report-sent'; to: string; props: { reportId: string } }
  /** To the consultant holding the lead: the owner accepted or declined a version. */
  | { template: 'report-answered'; to: string; props: { reportId: string } };

export type EmailTemplateName = OutgoingEmail['template'];
