import { pipeline } from 'node:stream/promises';
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { photoCalibrationInputSchema, photoUpdateSchema, photoVariants } from '../../shared/schemas/photo';
import { AppError } from '../errors';
import { requireAuth } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import type { PhotoService } from '../services/photo-service';
import { idSchema } from '../../shared/schemas/ids';

const uuid = idSchema;
const sightlineParams = z.object({ id: uuid });
const photoParams = z.object({ id: uuid });
const fileParams = z.object({ id: uuid, variant: z.enum(photoVariants, { error: 'Ask for thumb, display or original' }) });

/** The form field that carries the file. */
export const PHOTO_FIELD = 'photo';

/** multer in memory with the size limit; its errors become the API's JSON errors. */
function singlePhoto(maxBytes: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    defParamCharset: 'utf8',
    limits: { fileSize: maxBytes, files: 1, fields: 5, parts: 6, fieldSize: 1024 },
  }).single(PHOTO_FIELD);
  const maxMb = (maxBytes / (1024 * 1024)).toLocaleString('en', { maximumFractionDigits: 1 });
  return (req, res, next) => {
    upload(req, res, (error: unknown) => {
      if (!error) return next();
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          return next(new AppError('payload_too_large', `The photo is larger than ${maxMb} MB`, { [PHOTO_FIELD]: `At most ${maxMb} MB` }));
        }
        const message = error.code === 'LIMIT_UNEXPECTED_FILE' || error.code === 'LIMIT_FILE_COUNT'
          ? `Send one file in the form field "${PHOTO_FIELD}"`
          : 'The upload form is not in the expected shape';
        return next(new AppError('validation', message, { [PHOTO_FIELD]: message }));
      }
      next(error);
    });
  };
}

export interface PhotoRouterDeps {
  photos: PhotoService;
  maxBytes: number;
}

/** Mounted at /api/sightlines/:id/photos: upload and list. */
export function sightlinePhotosRouter({ photos, maxBytes }: PhotoRouterDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);

  router.get('/', async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    const list = await photos.list(req.user!, id);
    res.json({ photos: list.map((p) => p.toPublic({ showPrivate: photos.isOwner(req.user!, p) })) });
  });

  router.post('/', async (req, _res, next) => {
    // Who may upload, and whether there is room, before a byte of the file is read.
    const { id } = parseOrThrow(sightlineParams, req.params);
    await photos.assertCanAdd(req.user!, id);
    next();
  }, singlePhoto(maxBytes), async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    if (!req.file) {
      throw new AppError('validation', 'Choose a photo to upload', { [PHOTO_FIELD]: 'Choose a photo to upload' });
    }
    const photo = await photos.add(req.user!, id, { buffer: req.file.buffer, originalName: req.file.originalname });
    res.status(201).json({ photo: photo.toPublic({ showPrivate: true }) });
  });

  return router;
}

/** Mounted at /api/photos: renditions, GPS privacy, calibration, delete. */
export function photosRouter({ photos }: Pick<PhotoRouterDeps, 'photos'>): Router {
  const router = Router();
  router.use(requireAuth);

  router.get('/:id', async (req, res) => {
    const { id } = parseOrThrow(photoParams, req.params);
    const photo = await photos.get(req.user!, id);
    res.json({ photo: photo.toPublic({ showPrivate: photos.isOwner(req.user!, photo) }) });
  });

  router.put('/:id/calibration', validateBody(photoCalibrationInputSchema), async (req, res) => {
    const { id } = parseOrThrow(photoParams, req.params);
    const photo = await photos.calibrate(req.user!, id, req.body);
    res.json({ photo: photo.toPublic({ showPrivate: photos.isOwner(req.user!, photo) }) });
  });

  router.delete('/:id/calibration', async (req, res) => {
    const { id } = parseOrThrow(photoParams, req.params);
    const photo = await photos.clearCalibration(req.user!, id);
    res.json({ photo: photo.toPublic({ showPrivate: photos.isOwner(req.user!, photo) }) });
  });

  router.get('/:id/:variant', async (req, res) => {
    const { id, variant } = parseOrThrow(fileParams, req.params);
    const file = await photos.file(req.user!, id, variant);
    res.setHeader('Content-Type', file.contentType);
    res.setHeader('Cache-Control', 'private, max-age=3600');
    await pipeline(file.stream, res);
  });

  router.patch('/:id', validateBody(photoUpdateSchema), async (req, res) => {
    const { id } = parseOrThrow(photoParams, req.params);
    const photo = await photos.update(req.user!, id, req.body);
    res.json({ photo: photo.toPublic({ showPrivate: photos.isOwner(req.user!, photo) }) });
  });

  router.delete('/:id', async (req, res) => {
    const { id } = parseOrThrow(photoParams, req.params);
    await photos.remove(req.user!, id);
    res.status(204).end();
  });

  return router;
}
