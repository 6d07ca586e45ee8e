import { z } from 'zod'
import { manuscriptView } from '../../services/views'

const Params = z.object({ id: z.string() })

export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id })
  return manuscriptView(useDb(), grant)
})
