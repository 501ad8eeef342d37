import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '../../shared/errors';
import { AppError } from '../errors';

/** Unknown /api routes answer 404 JSON. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}`));
};

interface HttpishError { status?: number; statusCode?: number; type?: string; expose?: boolean; message?: string }

/** The one error middleware: every error leaves as `{ error: { code, message, fields? } }`, never a stack. */
export const errorHandler: ErrorRequestHandler = (err: unknown, _req, res, next) => {
  if (res.headersSent) return next(err);
  let body: ApiErrorBody;
  let status: number;
  if (err instanceof AppError) {
    status = err.status;
    body = { error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } };
  } else {
    const e = (err ?? {}) as HttpishError;
    const httpStatus = e.status ?? e.statusCode;
    if (e.type === 'entity.too.large') {
      status = 413;
      body = { error: { code: 'payload_too_large', message: 'Request body is too large' } };
    } else if (e.type === 'entity.parse.failed') {
      status = 400;
      body = { error: { code: 'validation', message: 'Request body is not valid JSON' } };
    } else if (httpStatus && httpStatus >= 400 && httpStatus < 500 && e.expose) {
      status = httpStatus;
      body = { error: { code: httpStatus === 404 ? 'not_found' : 'validation', message: e.message ?? 'Bad request' } };
    } else {
      status = 500;
      console.error('Unhandled error:', err);
      body = { error: { code: 'internal', message: 'Something went wrong on our side' } };
    }
  }
  res.status(status).json(body);
};
