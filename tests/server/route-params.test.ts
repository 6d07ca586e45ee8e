/**
 * Route parameters go through one helper, routeParamsAs (server/utils/fail.ts): a parameter that
 * does not validate names nothing, so the answer is 404 not-found, never a 500 from the database.
 * Regression: the arXiv route took any string as the manuscript id, and the withdraw route
 * answered a malformed id with 400 where every other route answers 404.
 */
import { describe, expect, it } from 'vitest'
import { newMember } from './helpers'

describe('route parameters that do not validate', () => {
  it('are 404 not-found on the arXiv, withdraw and invitation routes', async () => {
    const me = await newMember('params')
    const { body } = await me.client.post('/api/manuscripts', { title: 'Parameters' })
    const answers = [
      await me.client.post('/api/manuscripts/not-a-uuid/revisions/arxiv', { identifier: '2612.00002' }),
      await me.client.post(`/api/manuscripts/${body.id}/submissions/not-a-uuid/withdraw`),
      await me.client.get(`/api/invitations/${'x'.repeat(201)}`),
    ]
    expect(answers.map(a => [a.status, a.body?.data?.code])).toEqual([[404, 'not-found'], [404, 'not-found'], [404, 'not-found']])
  })
})
