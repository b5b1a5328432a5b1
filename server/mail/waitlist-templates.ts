import { renderMail } from './templates';
import type { OutgoingMail } from './mailer';

const sizeWords = { small: 'a small plot', medium: 'a medium plot', large: 'a large plot', any: 'any size of plot' } as const;

/** The confirmation an applicant gets: their place on the waitlist and what happens next. */
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
    subject: `You're on the ${p.clubName} waitlist: number ${p.position}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `Thank you for applying for a plot at ${p.clubName}. You are number ${p.position} on the waitlist. We noted that you would like ${wishes}.`,
      'What happens next: each spring the plot holders of last season renew first. Plots that are free after that are offered to the waitlist in order. When a plot comes free for you, you get an e-mail with a link to accept or decline it.',
      `You have ${p.offerDays} ${p.offerDays === 1 ? 'day' : 'days'} to answer an offer, so keep an eye on this address. Your place can change a little if the coordinator records a reason, for example a plot that suits a need you mentioned.`,
      'To change your details or leave the waitlist, reply to the club coordinator.',
    ],
    why: `You got this because this address was entered on the plot application form of ${p.clubName} on Tillwell. If it was not you, ignore this e-mail or ask the club to remove it.`,
  });
}
