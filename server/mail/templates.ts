// Plain-text and simple HTML bodies for every message the site sends. Words are ours.
import {
  RAW_MILK_LOCAL_RULES,
  RAW_MILK_MIN_AGING_DAYS,
  RAW_MILK_SALE_RULE,
  RAW_MILK_WHO_SHOULD_AVOID,
  rawMilkReadyCheck,
} from '../../shared/trade/aging';
import { dayInWords } from '../../shared/trade/time';
import type { OutgoingMail } from './mailer';

const escapeHtml = (value: string) =>
  value.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

function layout(
  to: string,
  subject: string,
  lines: string[],
  action?: { label: string; url: string },
): OutgoingMail {
  const text = [
    ...lines,
    ...(action ? ['', `${action.label}: ${action.url}`] : []),
    '',
    '— Rindwise',
  ].join('\n');
  const paragraphs = lines.map((line) => `<p>${escapeHtml(line)}</p>`).join('\n');
  const button = action
    ? `<p><a href="${escapeHtml(action.url)}" style="background:#6b3f1d;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(action.label)}</a></p>\n<p style="color:#6f6254;font-size:13px">Or paste this address into your browser: ${escapeHtml(action.url)}</p>`
    : '';
  const html = `<!doctype html><html><body style="font-family:sans-serif;color:#2d241c;max-width:560px">\n<h2 style="font-family:Georgia,serif">${escapeHtml(subject)}</h2>\n${paragraphs}\n${button}\n<p style="color:#6f6254">— Rindwise</p></body></html>`;
  return { to, subject, text, html };
}

export const mailTemplates = {
  verifyEmail: (to: string, name: string, url: string) =>
    layout(
      to,
      'Confirm your e-mail for Rindwise',
      [
        `Hello ${name},`,
        'Welcome to Rindwise. Please confirm this e-mail address so you can publish journals, comment and score wheels.',
        'The link works for 48 hours. If you did not sign up, ignore this message.',
      ],
      { label: 'Confirm my e-mail', url },
    ),

  signUpAttemptOnExisting: (to: string, name: string, signInUrl: string, resetUrl: string) =>
    layout(to, 'Someone tried to join Rindwise with your e-mail', [
      `Hello ${name},`,
      'Someone, perhaps you, tried to create a Rindwise account with this e-mail address, which already has one.',
      `If it was you, sign in at ${signInUrl}, or choose a new password at ${resetUrl}.`,
      'If it was not you, you can ignore this message: nothing has changed.',
    ]),

  resetPassword: (to: string, name: string, url: string) =>
    layout(
      to,
      'Choose a new Rindwise password',
      [
        `Hello ${name},`,
        'Someone asked to reset the password of your Rindwise account. The link below works once, for 30 minutes.',
        'If you did not ask for this, ignore this message: your password stays as it is.',
      ],
      { label: 'Choose a new password', url },
    ),

  confirmNewEmail: (to: string, name: string, url: string) =>
    layout(
      to,
      'Confirm your new e-mail for Rindwise',
      [
        `Hello ${name},`,
        'You asked to use this address for your Rindwise account. Confirm it with the link below (valid for 24 hours).',
      ],
      { label: 'Use this e-mail', url },
    ),

  passwordChanged: (to: string, name: string) =>
    layout(to, 'Your Rindwise password was changed', [
      `Hello ${name},`,
      'The password of your Rindwise account was just changed, and your other sessions were signed out.',
      'If you did not do this, reset your password at once with "Forgot password" on the sign-in page.',
    ]),

  /**
   * The aging target is reached. A raw-milk wheel gets the raw-milk lines (and, before the
   * 60-day mark, a subject that does not call it ready); a pasteurised one gets none.
   */
  wheelReady: (
    to: string,
    name: string,
    title: string,
    makeDate: string,
    targetDays: number,
    url: string,
    heatTreatment: string,
  ) => {
    const raw = rawMilkReadyCheck({ heatTreatment, madeOn: makeDate, targetDays });
    const rawLines = !raw
      ? []
      : raw.readyBeforeMinimum
        ? [
            `This wheel is made from unpasteurised milk, and its ${targetDays}-day target comes before the ${RAW_MILK_MIN_AGING_DAYS}-day mark, which it reaches on ${dayInWords(raw.minimumMetOn)}. ${RAW_MILK_SALE_RULE}`,
            `${RAW_MILK_WHO_SHOULD_AVOID} ${RAW_MILK_LOCAL_RULES}`,
          ]
        : [
            `This wheel is made from unpasteurised milk. ${RAW_MILK_SALE_RULE}`,
            `${RAW_MILK_WHO_SHOULD_AVOID} ${RAW_MILK_LOCAL_RULES}`,
          ];
    return layout(
      to,
      raw?.readyBeforeMinimum
        ? `Aging target reached (raw milk, under ${RAW_MILK_MIN_AGING_DAYS} days): ${title}`
        : `Ready to taste: ${title}`,
      [
        `Hello ${name},`,
        `Your wheel "${title}", made on ${makeDate}, has reached its aging target of ${targetDays} days.`,
        'When you open it, score it while the taste is fresh: overall liking and each attribute, with friends if they are there.',
        ...rawLines,
        'You can turn these reminders off in your account settings.',
      ],
      { label: 'Score this wheel', url },
    );
  },

  wheelCheck: (to: string, name: string, title: string, url: string) =>
    layout(
      to,
      `Time to check: ${title}`,
      [
        `Hello ${name},`,
        `You asked to be reminded to check "${title}" today: look at the rind, turn the wheel, and record a weigh-in if you can.`,
        'You can turn these reminders off in your account settings.',
      ],
      { label: 'Open the journal', url },
    ),

  newComment: (
    to: string,
    name: string,
    commenter: string,
    title: string,
    excerpt: string,
    url: string,
  ) =>
    layout(
      to,
      `${commenter} commented on ${title}`,
      [
        `Hello ${name},`,
        `${commenter} left a comment on your journal "${title}":`,
        `"${excerpt}"`,
        'You can turn these e-mails off in your account settings; the comments stay in your notifications on the site.',
      ],
      { label: 'Read and reply', url },
    ),

  accountSuspended: (to: string, name: string, note: string) =>
    layout(to, 'Your Rindwise account is suspended', [
      `Hello ${name},`,
      'An admin has suspended your Rindwise account after a report, so you cannot sign in for now.',
      ...(note ? [`Their note: ${note}`] : []),
      'If you think this is a mistake, reply to this message and tell us why.',
    ]),
};
