import { formatDate, formatDateTime } from '@shared/dates';
import { roleWords, type Role } from '@shared/schemas/auth';
import { MailLayout, P, renderMail } from './layout';

// The account and spring-round e-mails, each a component on the one layout (./layout.tsx).

interface InviteProps {
  to: string;
  name: string;
  clubName: string;
  roles: Role[];
  url: string;
  expiresAt: Date;
  timeZone: string;
}

export function InviteEmail(p: InviteProps) {
  return (
    <MailLayout
      preview={`Join ${p.clubName} on Tillwell`}
      greeting={`Hello ${p.name},`}
      actions={[{ label: 'Accept the invitation', url: p.url }]}
      why={`You got this because a coordinator of ${p.clubName} entered your address. If you did not expect it, ignore it.`}
    >
      <P>{`The coordinator of ${p.clubName} has invited you to join as ${roleWords(p.roles)}.`}</P>
      <P>{`Follow the link to choose your password. The link works once and expires on ${formatDateTime(p.expiresAt, p.timeZone)}.`}</P>
    </MailLayout>
  );
}

/** The e-mail that invites someone to a club. */
export function inviteMail(p: InviteProps) {
  return renderMail(p.to, `You're invited to ${p.clubName} on Tillwell`, <InviteEmail {...p} />);
}

interface PasswordResetProps {
  to: string;
  name: string;
  url: string;
  expiresAt: Date;
  timeZone: string;
}

export function PasswordResetEmail(p: PasswordResetProps) {
  return (
    <MailLayout
      preview="A link to choose a new password"
      greeting={`Hello ${p.name},`}
      actions={[{ label: 'Choose a new password', url: p.url }]}
      why="You got this because a password reset was asked for this address on Tillwell."
    >
      <P>Someone asked to reset the password of your Tillwell account.</P>
      <P>{`The link works once and expires on ${formatDateTime(p.expiresAt, p.timeZone)}. If it was not you, ignore this e-mail: your password stays as it is.`}</P>
    </MailLayout>
  );
}

/** The e-mail with a password reset link. */
export function passwordResetMail(p: PasswordResetProps) {
  return renderMail(p.to, 'Reset your Tillwell password', <PasswordResetEmail {...p} />);
}

interface RenewalProps {
  to: string;
  name: string;
  clubName: string;
  year: number;
  plotLabel: string;
  siteName: string;
  url: string;
  deadline: Date;
  timeZone: string;
}

export function RenewalEmail(p: RenewalProps) {
  return (
    <MailLayout
      preview={`Keep plot ${p.plotLabel} or give it up`}
      greeting={`Hello ${p.name},`}
      actions={[{ label: 'Keep or give up my plot', url: p.url }]}
      why={`You got this because you held a plot at ${p.clubName} last season. This message is part of the spring round and cannot be switched off.`}
    >
      <P>{`${p.clubName} is opening the ${p.year} season. You held plot ${p.plotLabel} at ${p.siteName} last season and are in good standing, so it is yours to keep.`}</P>
      <P>{`Follow the link to keep it or give it up. If we have no answer by ${formatDateTime(p.deadline, p.timeZone)}, the plot goes to the next person on the waiting list.`}</P>
    </MailLayout>
  );
}

/** The renewal e-mail: keep the plot or give it up, before the deadline. */
export function renewalMail(p: RenewalProps) {
  return renderMail(p.to, `Keep plot ${p.plotLabel} for ${p.year}? Please answer by ${formatDate(p.deadline, p.timeZone)}`, <RenewalEmail {...p} />);
}

interface OfferProps {
  to: string;
  name: string;
  clubName: string;
  year: number;
  plotLabel: string;
  siteName: string;
  size: string;
  fee: string;
  /** The offer's link; the e-mail adds `answer=accept` or `answer=decline` to it. */
  url: string;
  deadline: Date;
  timeZone: string;
}

export function OfferEmail(p: OfferProps) {
  return (
    <MailLayout
      preview={`Plot ${p.plotLabel} is free for you`}
      greeting={`Hello ${p.name},`}
      actions={[
        { label: 'Accept the plot', url: `${p.url}&answer=accept` },
        { label: 'Decline the plot', url: `${p.url}&answer=decline` },
      ]}
      why={`You got this because you are on the waiting list of ${p.clubName}.`}
    >
      <P>{`Good news: plot ${p.plotLabel} at ${p.siteName} (${p.size}) is free for the ${p.year} season and you are next on the waiting list.`}</P>
      <P>{`The season's fee would be ${p.fee}.`}</P>
      <P>{`Choose a link to accept or decline; each opens a page where you confirm. The offer stays open until ${formatDateTime(p.deadline, p.timeZone)}; after that the plot goes to the next person.`}</P>
    </MailLayout>
  );
}

/** The offer e-mail: a free plot for someone on the waiting list, with its deadline and fee. */
export function offerMail(p: OfferProps) {
  return renderMail(p.to, `A plot for you at ${p.clubName}: ${p.plotLabel} (answer by ${formatDate(p.deadline, p.timeZone)})`, <OfferEmail {...p} />);
}

interface WelcomeHolderProps {
  to: string;
  name: string;
  clubName: string;
  plotLabel: string;
  siteName: string;
  year: number;
  feeDue: string;
  dueOn: string;
  timeZone: string;
  passwordUrl: string | null;
}

export function WelcomeHolderEmail(p: WelcomeHolderProps) {
  return (
    <MailLayout
      preview={`Welcome to ${p.clubName}`}
      greeting={`Hello ${p.name},`}
      actions={p.passwordUrl ? [{ label: 'Choose my password', url: p.passwordUrl }] : []}
      why={`You got this because you accepted a plot offer from ${p.clubName}.`}
    >
      <P>{`Welcome to ${p.clubName}. Plot ${p.plotLabel} at ${p.siteName} is yours for the ${p.year} season.`}</P>
      <P>{`Your fee of ${p.feeDue} is due by ${formatDate(p.dueOn, p.timeZone)}. The coordinator will tell you how to pay.`}</P>
      {p.passwordUrl ? <P>To see your plot and your fee on Tillwell, choose a password for your account.</P> : null}
    </MailLayout>
  );
}

/** Sent after an offer is accepted: what is owed, and a link to set a password when the person has none. */
export function welcomeHolderMail(p: WelcomeHolderProps) {
  return renderMail(p.to, `Plot ${p.plotLabel} is yours for ${p.year}`, <WelcomeHolderEmail {...p} />);
}

interface ClubSignupProps {
  to: string;
  name: string;
  clubName: string;
  url: string;
  expiresAt: Date;
  timeZone: string;
}

export function ClubSignupEmail(p: ClubSignupProps) {
  return (
    <MailLayout
      preview={`Confirm your address to start ${p.clubName}`}
      greeting={`Hello ${p.name},`}
      actions={[{ label: 'Confirm and start the club', url: p.url }]}
      why="You got this because someone started a club on Tillwell with this address. If it was not you, ignore it: nothing is made until the link is followed."
    >
      <P>{`Follow the link to confirm this address and start ${p.clubName}. You will be its first coordinator.`}</P>
      <P>{`The link works once and expires on ${formatDateTime(p.expiresAt, p.timeZone)}. If you already have a Tillwell account with this address, the club is added to it and your password stays as it is.`}</P>
    </MailLayout>
  );
}

/** The e-mail that checks a new club's first coordinator's address. */
export function clubSignupMail(p: ClubSignupProps) {
  return renderMail(p.to, `Confirm your address to start ${p.clubName} on Tillwell`, <ClubSignupEmail {...p} />);
}
