import { randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { Sequelize, Transaction } from 'sequelize';
import type { PhotoCalibrationInput, PhotoUpdate, PhotoVariant } from '../../shared/schemas/photo';
import { sightlineGeometry } from '../../shared/geo';
import { CalibrationInputError, solvePhotoCalibration } from '../../shared/projection';
import { AppError } from '../errors';
import { PhotoModel } from '../models/photo';
import type { UserModel } from '../models/user';
import { photoStorageKeys, StorageNotFoundError, type PhotoStorage } from '../storage/photo-storage';
import { processPhoto } from './photo-image';
import type { SightlineService } from './sightline-service';
import type { SightlineAction } from './access-policy';

export interface PhotoLimits {
  /** Largest image, width x height, px. */
  maxPixels: number;
  /** Most photos one sightline holds. */
  perSightline: number;
}

/** An upload as the route hands it over (multer memory storage). */
export interface PhotoUpload {
  buffer: Buffer;
  originalName: string;
}

/** Bytes to send for one rendition. */
export interface PhotoFile {
  stream: Readable;
  contentType: string;
}

const WEBP = 'image/webp';
const MAX_NAME_LENGTH = 255;

/** A file name fit to show: no folders, no control characters, at most 255 characters. */
function cleanOriginalName(name: string): string {
  // eslint-disable-next-line no-control-regex
  const base = name.split(/[\\/]/).pop()!.replace(/[\u0000-\u001f\u007f]/g, '').trim();
  return (base || 'photo').slice(0, MAX_NAME_LENGTH);
}

/** Reference photos of a sightline: upload, list, renditions, GPS privacy, delete. */
export class PhotoService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly sightlines: SightlineService,
    private readonly storage: PhotoStorage,
    private readonly limits: PhotoLimits,
  ) {}

  /** Throws 404/403 unless the user may add photos to the sightline, 409 when it is full. Cheap: call before reading the upload. */
  async assertCanAdd(user: UserModel, sightlineId: string): Promise<void> {
    await this.sightlines.get(user, sightlineId, 'edit');
    await this.assertRoom(sightlineId);
  }

  private async assertRoom(sightlineId: string, transaction?: Transaction): Promise<void> {
    const count = await PhotoModel.count({ where: { sightlineId }, transaction });
    if (count >= this.limits.perSightline) {
      throw new AppError('conflict', `A sightline holds at most ${this.limits.perSightline} photos; delete one first`);
    }
  }

  /**
   * Decodes and stores the upload: the three files first, then the row inside a transaction that
   * locks the sightline (so two uploads cannot both take the last place). On any failure the written
   * files are deleted again, so a refused upload leaves neither row nor file.
   */
  async add(user: UserModel, sightlineId: string, upload: PhotoUpload): Promise<PhotoModel> {
    const processed = await processPhoto(upload.buffer, this.limits.maxPixels);
    const id = randomUUID();
    const keys = photoStorageKeys(id);
    const written: string[] = [];
    try {
      for (const [key, data, type] of [
        [keys.original, upload.buffer, processed.mimeType],
        [keys.display, processed.display, WEBP],
        [keys.thumb, processed.thumb, WEBP],
      ] as const) {
        written.push(key);
        await this.storage.put(key, data, type);
      }
      await this.sequelize.transaction(async (transaction) => {
        await this.sightlines.get(user, sightlineId, 'edit', transaction);
        await this.assertRoom(sightlineId, transaction);
        await PhotoModel.create({
          id,
          sightlineId,
          ownerId: user.id,
          originalName: cleanOriginalName(upload.originalName),
          mimeType: processed.mimeType,
          width: processed.width,
          height: processed.height,
          byteSize: upload.buffer.length,
          originalKey: keys.original,
          displayKey: keys.display,
          thumbKey: keys.thumb,
          exif: processed.exif,
        }, { transaction });
      });
    } catch (error) {
      await this.deleteFiles(written);
      throw error;
    }
    return (await PhotoModel.findByPk(id))!;
  }

  /** The sightline's photos, oldest first (404/403 as for the sightline). */
  async list(user: UserModel, sightlineId: string): Promise<PhotoModel[]> {
    await this.sightlines.get(user, sightlineId, 'read');
    return PhotoModel.findAll({ where: { sightlineId }, order: [['createdAt', 'ASC'], ['id', 'ASC']] });
  }

  /** The photo if the user may do the action on its sightline; 404 when they may not even read it. */
  async get(user: UserModel, photoId: string, action: SightlineAction = 'read'): Promise<PhotoModel> {
    const photo = await PhotoModel.findByPk(photoId);
    if (!photo) throw AppError.notFound('No such photo');
    try {
      await this.sightlines.get(user, photo.sightlineId, action);
    } catch (error) {
      if (error instanceof AppError && error.code === 'not_found') throw AppError.notFound('No such photo');
      if (error instanceof AppError && error.code === 'forbidden') throw new AppError('forbidden', 'Only the owner and editors can change this photo');
      throw error;
    }
    return photo;
  }

  /** True when the user sees the photo's private parts (GPS even when hidden, the original). */
  isOwner(user: UserModel, photo: PhotoModel): boolean {
    return photo.ownerId === user.id;
  }

  /** One rendition's bytes. The original (with all its metadata) goes to the owner only (403 otherwise). */
  async file(user: UserModel, photoId: string, variant: PhotoVariant): Promise<PhotoFile> {
    const photo = await this.get(user, photoId, 'read');
    if (variant === 'original' && !this.isOwner(user, photo)) {
      throw new AppError('forbidden', 'Only the owner can download the original');
    }
    const key = variant === 'original' ? photo.originalKey : variant === 'display' ? photo.displayKey : photo.thumbKey;
    try {
      return { stream: await this.storage.get(key), contentType: variant === 'original' ? photo.mimeType : WEBP };
    } catch (error) {
      if (error instanceof StorageNotFoundError) throw AppError.notFound('The photo file is missing');
      throw error;
    }
  }

  /** Shows or hides the GPS position to others: the photo's owner only (it is their position). */
  async update(user: UserModel, photoId: string, change: PhotoUpdate): Promise<PhotoModel> {
    const photo = await this.get(user, photoId, 'read');
    if (!this.isOwner(user, photo)) throw new AppError('forbidden', 'Only the person who uploaded the photo can show or hide its position');
    await photo.update({ hideGps: change.hideGps });
    return photo;
  }

  /**
   * Solves and saves the sky overlay's calibration: the landmark top's direction comes from the
   * sightline's pins as they are now, the pose from the clicks and the lens. Editors only.
   */
  async calibrate(user: UserModel, photoId: string, input: PhotoCalibrationInput): Promise<PhotoModel> {
    return this.sequelize.transaction(async (transaction) => {
      const photo = await this.get(user, photoId, 'edit');
      const sightline = (await this.sightlines.get(user, photo.sightlineId, 'edit', transaction)).toPublic();
      const geometry = sightlineGeometry(sightline.vantage, sightline.landmark);
      const landmark = { azimuthDeg: geometry.trueBearingDeg, altitudeDeg: geometry.topElevationDeg };
      let solved;
      try {
        solved = solvePhotoCalibration(input, landmark, { widthPx: photo.width, heightPx: photo.height });
      } catch (error) {
        if (error instanceof CalibrationInputError) throw new AppError('validation', error.message, { [error.field]: error.message });
        throw error;
      }
      await photo.update({
        calibration: { ...input, landmark, pose: solved.pose, residualPx: solved.residualPx, calibratedAt: new Date().toISOString() },
      }, { transaction });
      return photo;
    });
  }

  /** Removes the calibration (editors only). */
  async clearCalibration(user: UserModel, photoId: string): Promise<PhotoModel> {
    const photo = await this.get(user, photoId, 'edit');
    await photo.update({ calibration: null });
    return photo;
  }

  /** Deletes the row, then its files (a file that cannot be deleted is logged, never left behind a live row). */
  async remove(user: UserModel, photoId: string): Promise<void> {
    const photo = await this.get(user, photoId, 'edit');
    await photo.destroy();
    await this.deleteFiles([photo.originalKey, photo.displayKey, photo.thumbKey]);
  }

  /**
   * Deletes every photo of the sightline, rows then files. No access check: for the sightline's own
   * delete, which has checked already and must call this before the row goes (the cascade would
   * remove the photo rows but cannot remove files). Returns how many photos went.
   */
  async removeAllOfSightline(sightlineId: string): Promise<number> {
    const all = await PhotoModel.findAll({ where: { sightlineId } });
    await PhotoModel.destroy({ where: { id: all.map((p) => p.id) } });
    await this.deleteFiles(all.flatMap((p) => [p.originalKey, p.displayKey, p.thumbKey]));
    return all.length;
  }

  private async deleteFiles(keys: string[]): Promise<void> {
    const results = await Promise.allSettled(keys.map((key) => this.storage.delete(key)));
    results.forEach((result, i) => {
      if (result.status === 'rejected') console.error(`Deleting photo file ${keys[i]} failed:`, result.reason);
    });
  }
}
