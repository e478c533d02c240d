import type { Db } from '../db/knex';

// Knex for the mail the local SMTP sink caught (the sink writes it: sink.ts).

export interface DevMail {
  id: number;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string;
  createdAt: string;
}

/** The newest 200 messages the local SMTP sink caught. */
export async function caughtMail(db: Db): Promise<DevMail[]> {
  const rows = await db('dev_mail').orderBy('id', 'desc').limit(200);
  return rows.map((r) => ({
    id: r.id,
    to: String(r.to_addresses).split(', ').filter(Boolean),
    from: r.from_address,
    subject: r.subject,
    text: r.text_body,
    html: r.html_body,
    createdAt: new Date(r.created_at).toISOString(),
  }));
}
