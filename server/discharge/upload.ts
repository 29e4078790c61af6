import type { RequestHandler } from 'express'
import multer from 'multer'
import { ApiError } from '../http/errors'
import { DISCHARGE_LOG_FIELD, DISCHARGE_LOG_MAX_BYTES } from '../../shared/discharge/log'

// One CSV file in memory, every multer limit set (multer's README: set every `limits`
// field): a form that is anything more than that one file is refused before it is buffered.
const upload = multer({
  storage: multer.memoryStorage(),
  defParamCharset: 'utf8',
  limits: {
    fileSize: DISCHARGE_LOG_MAX_BYTES,
    files: 1,
    fields: 4,
    fieldSize: 1024,
    fieldNameSize: 100,
    fieldNestingDepth: 0,
    fieldArrayIndexLimit: 0,
    parts: 5,
    headerPairs: 50,
  },
}).single(DISCHARGE_LOG_FIELD)

const megabytes = DISCHARGE_LOG_MAX_BYTES / (1024 * 1024)

function asApiError(error: unknown): ApiError {
  if (error instanceof multer.MulterError) {
    switch (error.code) {
      case 'LIMIT_FILE_SIZE':
        return new ApiError(
          413,
          'too-large',
          `The log file is larger than ${megabytes} MB. Log less often, or split the run into parts. Nothing was stored.`,
        )
      case 'LIMIT_FIELD_VALUE':
      case 'LIMIT_FIELD_KEY':
        return new ApiError(413, 'too-large', 'A form field of the upload is too long.')
      case 'LIMIT_FILE_COUNT':
      case 'LIMIT_UNEXPECTED_FILE':
        return new ApiError(
          400,
          'invalid-upload',
          `Send exactly one file, in the form field "${DISCHARGE_LOG_FIELD}".`,
          [{ path: DISCHARGE_LOG_FIELD, message: 'Send exactly one CSV file here' }],
        )
      default:
        return new ApiError(400, 'invalid-upload', `The upload form was refused: ${error.message}.`)
    }
  }
  // busboy's own failures (a cut-off or malformed multipart body) are the client's, not ours.
  return new ApiError(
    400,
    'invalid-upload',
    'The upload is not a complete multipart form. Send the log again.',
  )
}

/** The uploaded log as `req.file`; failures become our error shape (413 for a file too big). */
export const receiveLogFile: RequestHandler = (req, res, next) => {
  upload(req, res, (error: unknown) => {
    if (error) next(asApiError(error))
    else next()
  })
}
