import { renderMail } from './templates';
import type { OutgoingMail } from './mailer';

const sizeWords = { small: 'a small plot', medium: 'a medium plot', large: 'a large plot', any: 'any size of plot' } as const;

/** The confirmation an applicant gets: their place on the waiting list and what happens next. */
export function applicationReceivedMail(p: {
  to: string;
  name: string;
  clubName: string;
  position: number;
  preferredSize: keyof typeof sizeWords;
  needs: string[];
  siteName: string | null;
  offerDays: number;
}): OutgoingMail {
  const wishes = [sizeWords[p.preferredSize], ...p.needs, ...(p.siteName ? [`at ${p.siteName}`] : [])].join(', ');
  return renderMail({
    to: p.to,
    subject: `You're on the ${p.clubName} waiting list: number ${p.position}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `Thank you for applying for a plot at ${p.clubName}. You are number ${p.position} on the waiting list. We noted that you would like ${wishes}.`,
      'What happens next: each spring the plot holders of last season renew first. Plots that are free after that are offered to the waiting list in order. When a plot comes free for you, you get an e-mail with a link to accept or decline it.',
      `You have ${p.offerDays} ${p.offerDays === 1 ? 'day' : 'days'} to answer an offer, so keep an eye on this address. Your place can change a little if the coordinator records a reason, for example a plot that suits a need you mentioned.`,
      'To change your details or leave the waiting list, reply to the club coordinator.',
    ],
    why: `You got this because this address was entered on the plot application form of ${p.clubName} on Tillwell. If it was not you, ignore this e-mail or ask the club to remove it.`,
  });
}

/**
 * Sent instead of telling the form that an address is already waiting: the form answers as for a
 * new application, and only the address's owner learns they were already on the list, and where.
 */
export function alreadyOnWaitlistMail(p: {
  to: string;
  name: string;
  clubName: string;
  /** Their place while waiting; null when a plot is on offer to them. */
  position: number | null;
}): OutgoingMail {
  return renderMail({
    to: p.to,
    subject:
      p.position === null
        ? `You're already on the ${p.clubName} waiting list, with a plot on offer`
        : `You're already on the ${p.clubName} waiting list: number ${p.position}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `This address was entered again on the plot application form of ${p.clubName}. It was already on the waiting list, so the new form was not kept: your earlier application and its date stand.`,
      p.position === null
        ? 'A plot is on offer to you at the moment. The e-mail with the offer has the link to accept or decline it.'
        : `You are number ${p.position} on the waiting list. When a plot comes free for you, you get an e-mail with a link to accept or decline it.`,
      'To change your details or leave the waiting list, reply to the club coordinator.',
    ],
    why: `You got this because this address was entered on the plot application form of ${p.clubName} on Tillwell. If it was not you, ignore this e-mail or ask the club to remove it.`,
  });
}
