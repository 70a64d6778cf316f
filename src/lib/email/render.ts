/**
 * Turns an OutgoingEmail (data) into subject, HTML and text: loads what the template needs
 * from the database, reads the stored estimate and takes its figures from the shared
 * presentation (in the owner's units, as on their page), renders the React Email template.
 */
import { render } from '@react-email/components';
import { createElement, type ReactElement } from 'react';
import { getDb } from '../../db/client';
import { getAssessmentForMail } from '../../db/queries/assessments';
import { plantTypes } from '../../schemas/assessment';
import { unitSystemOf } from '../assessments/questionnaire';
import { readStoredResult, storedPlantInput } from '../assessments/stored-result';
import { presentResult, serviceWords } from '../presentation';
import { appBaseUrl } from '../site';
import type { RenderedEmail } from './mailer';
import type { OutgoingEmail } from './messages';
import { ConsultantAlert, consultantAlertSubject } from './templates/ConsultantAlert';
import { ConsultantIntroduction, consultantIntroductionSubject } from './templates/ConsultantIntroduction';
import { findConsultantProfile } from '../../db/queries/leads';
import { SignInLink, signInLinkSubject } from './templates/SignInLink';
import { reportMailFor } from '../reports/mail';
import { SubmissionConfirmation, submissionConfirmationSubject } from './templates/SubmissionConfirmation';
import {
  ConsultantInvitation,
  consultantInvitationSubject,
  LeadAssigned,
  leadAssignedSubject,
  PasswordReset,
  passwordResetSubject,
  StaleDigest,
  staleDigestSubject,
  UnroutedNotice,
  unroutedNoticeSubject,
} from './templates/TeamMail';

const longDate = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeZone: 'UTC' });

async function both(element: ReactElement): Promise<{ html: string; text: string }> {
  const [html, text] = await Promise.all([render(element), render(element, { plainText: true })]);
  return { html, text };
}

/** A permanent failure: retrying cannot help (the assessment is gone). */
export class NothingToSend extends Error {}

async function loadAssessment(assessmentId: string) {
  const found = await getAssessmentForMail(getDb(), assessmentId);
  if (!found) throw new NothingToSend(`assessment ${assessmentId} no longer exists`);
  const reading = readStoredResult({
    resultSnapshot: found.resultSnapshot,
    engineVersion: found.engineVersion,
    input: storedPlantInput(found.questionnaire, found.runs.map((run) => run.spec)),
  });
  // The mail still goes (the owner needs their sign-in link); it just carries no figures.
  if (reading.status === 'unreadable') console.error(`[mail] assessment ${assessmentId}: ${reading.reason}`);
  // In the owner's units, as on their page and on the results they saw.
  const presented = reading.status === 'unreadable' ? null : presentResult(reading.result, { system: unitSystemOf(found.questionnaire) });
  return { found, presented };
}

function plantTypeName(id: string): string {
  return plantTypes.find((t) => t.id === id)?.name ?? 'Food plant';
}

export async function renderEmail(email: OutgoingEmail): Promise<RenderedEmail> {
  switch (email.template) {
    case 'sign-in-link':
      return { to: email.to, subject: signInLinkSubject, ...(await both(createElement(SignInLink, email.props))) };
    case 'submission-confirmation': {
      const { found, presented } = await loadAssessment(email.props.assessmentId);
      const element = createElement(SubmissionConfirmation, {
        contactName: found.contactName,
        reference: found.reference,
        plantLabel: found.plantName || found.companyName,
        runCount: found.runs.length,
        signInUrl: email.props.signInUrl,
        signInPageUrl: `${appBaseUrl()}/sign-in`,
        regionName: found.regionName,
        postalCode: found.postalCode,
        figures: presented && {
          annualCost: {
            likely: presented.headline.lossCost.value,
            low: presented.headline.lossCost.range?.low ?? presented.headline.lossCost.value,
            high: presented.headline.lossCost.range?.high ?? presented.headline.lossCost.value,
          },
          annualSaving: presented.headline.saving.value,
          payback: presented.headline.payback.value,
          runsWithHazards: presented.runsWithHazards,
        },
      });
      return { to: email.to, subject: submissionConfirmationSubject(found.reference), ...(await both(element)) };
    }
    case 'consultant-alert': {
      const { found, presented } = await loadAssessment(email.props.assessmentId);
      const services = [...new Set(found.runs.map((run) => serviceWords(run.service).toLowerCase()))];
      const props = {
        consultantName: email.props.consultantName,
        reference: found.reference,
        regionName: found.regionName ?? 'your region',
        plantType: plantTypeName(found.plantType),
        area: `${found.postalCodeNormalised.slice(0, 3)} (${found.countryCode})`,
        runCount: found.runs.length,
        services: services.join(', '),
        figures: presented && {
          annualCost: presented.headline.lossCost.value,
          annualSaving: presented.headline.saving.value,
          runsWithHazards: presented.runsWithHazards,
        },
        claimUrl: `${appBaseUrl()}/desk/leads/${found.id}`,
        ...(email.props.reopened ? { reopened: true } : {}),
      };
      return { to: email.to, subject: consultantAlertSubject(props), ...(await both(createElement(ConsultantAlert, props))) };
    }
    case 'consultant-introduction': {
      const found = await getAssessmentForMail(getDb(), email.props.assessmentId);
      if (!found) throw new NothingToSend(`assessment ${email.props.assessmentId} no longer exists`);
      const consultant = await findConsultantProfile(getDb(), email.props.consultantUserId);
      if (!consultant) throw new NothingToSend(`consultant ${email.props.consultantUserId} no longer exists`);
      const props = {
        contactName: found.contactName,
        reference: found.reference,
        plantLabel: found.plantName || found.companyName,
        consultantName: consultant.name,
        firm: consultant.firm,
        phone: consultant.phone,
        email: consultant.email,
        assessmentUrl: `${appBaseUrl()}/my/assessments/${found.id}`,
      };
      return { to: email.to, subject: consultantIntroductionSubject(props), ...(await both(createElement(ConsultantIntroduction, props))) };
    }
    case 'consultant-invitation': {
      const props = { ...email.props, expiresOn: longDate.format(new Date(email.props.expiresAt)) };
      return { to: email.to, subject: consultantInvitationSubject(props), ...(await both(createElement(ConsultantInvitation, props))) };
    }
    case 'password-reset':
      return { to: email.to, subject: passwordResetSubject, ...(await both(createElement(PasswordReset, email.props))) };
    case 'admin-unrouted': {
      const { found, presented } = await loadAssessment(email.props.assessmentId);
      const props = {
        adminName: email.props.adminName,
        reference: found.reference,
        plantType: plantTypeName(found.plantType),
        place: `${found.postalCode} (${found.countryCode})`,
        annualCost: presented ? presented.headline.lossCost.value : null,
        leadUrl: `${appBaseUrl()}/desk/leads/${found.id}`,
        attentionUrl: `${appBaseUrl()}/admin/attention`,
      };
      return { to: email.to, subject: unroutedNoticeSubject(props), ...(await both(createElement(UnroutedNotice, props))) };
    }
    case 'admin-stale-digest': {
      const props = {
        ...email.props,
        leads: email.props.leads.map((lead) => ({ ...lead, url: `${appBaseUrl()}/desk/leads/${lead.id}` })),
        attentionUrl: `${appBaseUrl()}/admin/attention`,
      };
      return { to: email.to, subject: staleDigestSubject(props), ...(await both(createElement(StaleDigest, props))) };
    }
    case 'lead-assigned': {
      const found = await getAssessmentForMail(getDb(), email.props.assessmentId);
      if (!found) throw new NothingToSend(`assessment ${email.props.assessmentId} no longer exists`);
      const props = {
        consultantName: email.props.consultantName,
        reference: found.reference,
        plantType: plantTypeName(found.plantType),
        area: `${found.postalCodeNormalised.slice(0, 3)} (${found.countryCode})`,
        reason: email.props.reason,
        leadUrl: `${appBaseUrl()}/desk/leads/${found.id}`,
      };
      return { to: email.to, subject: leadAssignedSubject(props), ...(await both(createElement(LeadAssigned, props))) };
    }
    case 'report-sent':
    case 'report-answered': {
      const mail = await reportMailFor(email);
      if (!mail) throw new NothingToSend(`report ${email.props.reportId} no longer exists`);
      return { to: email.to, subject: mail.subject, ...(await both(mail.element)), ...(mail.attachments ? { attachments: mail.attachments } : {}) };
    }
  }
}
