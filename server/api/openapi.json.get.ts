import { openApiDocument } from '../openapi/document'

/** The OpenAPI 3.1 description of every route, generated from the routes' zod schemas (public, like the app's pages). */
export default defineApiHandler(() => openApiDocument())
