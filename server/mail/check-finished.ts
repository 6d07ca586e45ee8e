/**
 * The "check finished" notice: when a run that took a while (queued → finished) is
 * done, the person who asked for it gets the counts and a link to the report.
 * Short runs send nothing: whoever started them is still looking at the page.
 * Used by the worker process, so it takes its settings from the environment.
 */
import type { Db } from '../database/connect'
import { verdictCountsOf } from '../../shared/types/report-schema'
import { checkFinishedMail } from './messages'
import { publicBaseUrlFromEnv, type MailSender } from './transport'

export interface CheckMailSettings {
  send: MailSender
  /** Links point here, e.g. `http://127.0.0.1:3000`. */
  baseUrl: string
  /** Only runs that took at least this long from queued to finished are mailed about. */
  minSeconds: number
}

export const DEFAULT_MIN_SECONDS = 5

/** `SCHOLIUM_MAIL_RUNS_LONGER_THAN_SECONDS` (default 5) and NUXT_PUBLIC_BASE_URL, with the sender given. */
export function checkMailSettingsFromEnv(send: MailSender, env: NodeJS.ProcessEnv = process.env): CheckMailSettings {
  const raw = env.SCHOLIUM_MAIL_RUNS_LONGER_THAN_SECONDS ?? String(DEFAULT_MIN_SECONDS)
  const minSeconds = Number(raw)
  if (raw.trim() === '' || !Number.isFinite(minSeconds) || minSeconds < 0) {
    throw new Error('SCHOLIUM_MAIL_RUNS_LONGER_THAN_SECONDS must be a number of seconds, 0 or more')
  }
  return { send, baseUrl: publicBaseUrlFromEnv(env), minSeconds }
}

export type CheckMailOutcome = 'sent' | 'short' | 'no-recipient' | 'not-finished'

/** Mails the requester of a finished run if it took at least `minSeconds`. Throws only if sending fails. */
export async function mailIfLongRun(db: Db, settings: CheckMailSettings, checkRunId: string): Promise<CheckMailOutcome> {
  const run = await db.selectFrom('check_runs as c')
    .innerJoin('revisions as r', 'r.id', 'c.revision_id')
    .innerJoin('manuscripts as m', 'm.id', 'r.manuscript_id')
    .leftJoin('users as u', 'u.id', 'c.requested_by')
    .select(['c.status', 'c.queued_at', 'c.finished_at', 'c.summary', 'r.id as revisionId', 'r.number', 'm.title', 'u.email'])
    .where('c.id', '=', checkRunId)
    .executeTakeFirst()
  if (!run || run.status !== 'finished' || !run.finished_at) return 'not-finished'
  const seconds = (run.finished_at.getTime() - run.queued_at.getTime()) / 1000
  if (seconds < settings.minSeconds) return 'short'
  // Runs made by the system (demo seed, maintenance) have no requester.
  if (!run.email) return 'no-recipient'
  await settings.send(checkFinishedMail({
    to: run.email,
    manuscriptTitle: run.title,
    revisionNumber: run.number,
    counts: verdictCountsOf(run.summary) ?? { claims: 0, verified: 0, mismatch: 0, unsupported: 0, error: 0 },
    link: `${settings.baseUrl}/revisions/${run.revisionId}`,
    seconds: Math.round(seconds),
  }))
  return 'sent'
}
