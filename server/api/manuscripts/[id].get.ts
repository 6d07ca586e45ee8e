import { manuscriptView } from '../../services/views'

export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id })
  return manuscriptView(useDb(), grant)
})
