import type { OutgoingMail } from './mailer';
import { MailLayout, P, renderMail } from './layout';

const sizeWords = { small: 'a small plot', medium: 'a medium plot', large: 'a large plot', any: 'any size of plot' } as const;

const formWhy = (clubName: string) =>
  `You got this because this address was entered on the plot application form of ${clubName} on Tillwell. If it was not you, ignore this e-mail or ask the club to remove it.`;

interface ApplicationReceivedProps {
  to: string;
  name: string;
  clubName: string;
  position: number;
  preferredSize: keyof typeof sizeWords;
  needs: string[];
  siteName: string | null;
  offerDays: number;
}

export function ApplicationReceivedEmail(p: ApplicationReceivedProps) {
  const wishes = [sizeWords[p.preferredSize], ...p.needs, ...(p.siteName ? [`at ${p.siteName}`] : [])].join(', ');
  return (
    <MailLayout preview={`Number ${p.position} on the waiting list`} greeting={`Hello ${p.name},`} why={formWhy(p.clubName)}>
      <P>{`Thank you for applying for a plot at ${p.clubName}. You are number ${p.position} on the waiting list. We noted that you would like ${wishes}.`}</P>
      <P>
        What happens next: each spring the plot holders of last season renew first. Plots that are free after that are offered to the waiting list in
        order. When a plot comes free for you, you get an e-mail with a link to accept or decline it.
      </P>
      <P>{`You have ${p.offerDays} ${p.offerDays === 1 ? 'day' : 'days'} to answer an offer, so keep an eye on this address. Your place can change a little if the coordinator records a reason, for example a plot that suits a need you mentioned.`}</P>
      <P>To change your details or leave the waiting list, reply to the club coordinator.</P>
    </MailLayout>
  );
}

/** The confirmation an applicant gets: their place on the waiting list and what happens next. */
export function applicationReceivedMail(p: ApplicationReceivedProps): Promise<OutgoingMail> {
  return renderMail(p.to, `You're on the ${p.clubName} waiting list: number ${p.position}`, <ApplicationReceivedEmail {...p} />);
}

interface AlreadyOnWaitlistProps {
  to: string;
  name: string;
  clubName: string;
  /** Their place while waiting; null when a plot is on offer to them. */
  position: number | null;
}

export function AlreadyOnWaitlistEmail(p: AlreadyOnWaitlistProps) {
  return (
    <MailLayout preview="Your earlier application stands" greeting={`Hello ${p.name},`} why={formWhy(p.clubName)}>
      <P>{`This address was entered again on the plot application form of ${p.clubName}. It was already on the waiting list, so the new form was not kept: your earlier application and its date stand.`}</P>
      <P>
        {p.position === null
          ? 'A plot is on offer to you at the moment. The e-mail with the offer has the link to accept or decline it.'
          : `You are number ${p.position} on the waiting list. When a plot comes free for you, you get an e-mail with a link to accept or decline it.`}
      </P>
      <P>To change your details or leave the waiting list, reply to the club coordinator.</P>
    </MailLayout>
  );
}

/**
 * Sent instead of telling the form that an address is already waiting: the form answers as for a
 * new application, and only the address's owner learns they were already on the list, and where.
 */
export function alreadyOnWaitlistMail(p: AlreadyOnWaitlistProps): Promise<OutgoingMail> {
  const subject =
    p.position === null
      ? `You're already on the ${p.clubName} waiting list, with a plot on offer`
      : `You're already on the ${p.clubName} waiting list: number ${p.position}`;
  return renderMail(p.to, subject, <AlreadyOnWaitlistEmail {...p} />);
}
