/** A rendered e-mail. Text is always present: many site phones read mail as plain text. */
export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string,
  );

function layout(
  title: string,
  paragraphs: string[],
  action?: { label: string; url: string },
): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join('');
  const button = action
    ? `<p><a href="${escapeHtml(action.url)}" style="background:#1f4e5a;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(action.label)}</a></p>`
    : '';
  return `<!doctype html><html><body style="font-family:sans-serif;color:#1d2327;max-width:560px">
<h1 style="font-size:20px">${escapeHtml(title)}</h1>${body}${button}
<p style="color:#5b6670;font-size:12px">Sent by Latchwork on behalf of your flooring contractor.</p></body></html>`;
}

function required(params: Record<string, string>, name: string): string {
  const value = params[name];
  if (value === undefined || value === '') throw new Error(`Mail parameter "${name}" is missing`);
  return value;
}

/** Every e-mail the product sends, by name. Later features add their own templates here. */
export const MAIL_TEMPLATES = {
  notice(params: Record<string, string>): RenderedMail {
    const title = required(params, 'title');
    const message = required(params, 'message');
    return { subject: title, text: `${title}\n\n${message}\n`, html: layout(title, [message]) };
  },
  invitation(params: Record<string, string>): RenderedMail {
    const firm = required(params, 'firm');
    const url = required(params, 'url');
    const expires = required(params, 'expires');
    const subject = `You are invited to ${firm} on Latchwork`;
    const lines = [
      `${firm} has invited you to join their team on Latchwork.`,
      `The link works once and expires ${expires}.`,
    ];
    return {
      subject,
      text: `${lines.join('\n')}\n\nSet your password: ${url}\n`,
      html: layout(subject, lines, { label: 'Set your password', url }),
    };
  },
  invitationExisting(params: Record<string, string>): RenderedMail {
    const firm = required(params, 'firm');
    const url = required(params, 'url');
    const subject = `You have been added to ${firm} on Latchwork`;
    const lines = [
      `${firm} has added you to their team on Latchwork.`,
      'Sign in with your existing Latchwork password and choose the firm at the top of the page.',
    ];
    return {
      subject,
      text: `${lines.join('\n')}\n\nSign in: ${url}\n`,
      html: layout(subject, lines, { label: 'Sign in', url }),
    };
  },
  /** A team member named a colleague with @ in a job's note. */
  mention(params: Record<string, string>): RenderedMail {
    const author = required(params, 'author');
    const job = required(params, 'job');
    const excerpt = required(params, 'excerpt');
    const url = required(params, 'url');
    const subject = `${author} mentioned you on ${job}`;
    const lines = [`${author} mentioned you in a note on job ${job}:`, excerpt];
    return {
      subject,
      text: `${lines.join('\n\n')}\n\nOpen the job: ${url}\n`,
      html: layout(subject, lines, { label: 'Open the job', url }),
    };
  },
  /** A purchase order to a supplier; the order itself is the attached PDF. */
  purchaseOrder(params: Record<string, string>): RenderedMail {
    const firm = required(params, 'firm');
    const reference = required(params, 'reference');
    const supplier = required(params, 'supplier');
    const subject = `Purchase order ${reference} from ${firm}`;
    const lines = [
      `Dear ${supplier},`,
      `Please find our purchase order ${reference} attached.`,
      ...(params['message'] ? [params['message']] : []),
      `Please quote ${reference} on your delivery note and invoice.`,
      firm,
    ];
    return { subject, text: `${lines.join('\n\n')}\n`, html: layout(subject, lines) };
  },
} satisfies Record<string, (params: Record<string, string>) => RenderedMail>;

export type MailTemplateName = keyof typeof MAIL_TEMPLATES;
