/**
 * Multipart uploads with every part bounded. multer bounds only what it is told to: by
 * default any number of text fields of up to 1 MB each, held in memory. Each route names
 * its one file field, its size, and how many small text fields it takes; a declared body
 * larger than that is refused before a byte is read, and busboy stops a body that grows
 * past any limit while it streams. Routes put their ability check in front of this, so a
 * caller who may not upload is refused before the body is read at all.
 */
import type { RequestHandler } from 'express';
import multer from 'multer';
import { appError, type UploadResource } from '@swardwise/domain';

export interface UploadLimits {
  /** Form field of the one file. */
  field: string;
  /** Largest file, bytes. */
  maxFileBytes: number;
  /** Text fields the route reads (besides the file). */
  maxFields: number;
  /** Largest text field value, bytes. */
  maxFieldBytes?: number;
  /** Error code prefix of the route (`import`, `weather`, `work_photo`). */
  code: UploadResource;
  /** The file in words for messages ("The photo", "The file"). */
  what: string;
}

const FIELD_BYTES = 1024;
/** Room for part headers and boundaries beside the file and fields. */
const OVERHEAD_BYTES = 64 * 1024;

const mb = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;

/** Reads one file and a few text fields into memory (req.file, req.body), within the limits. */
export function receiveUpload(limits: UploadLimits): RequestHandler {
  const fieldBytes = limits.maxFieldBytes ?? FIELD_BYTES;
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: limits.maxFileBytes,
      files: 1,
      fields: limits.maxFields,
      fieldSize: fieldBytes,
      fieldNameSize: 100,
      parts: limits.maxFields + 1,
      headerPairs: 20,
    },
  }).single(limits.field);
  const maxBody = limits.maxFileBytes + limits.maxFields * (fieldBytes + 200) + OVERHEAD_BYTES;
  const tooLarge = (message: string) => appError(`${limits.code}/too_large`, message);

  return (req, res, next) => {
    const declared = Number(req.get('content-length'));
    if (Number.isFinite(declared) && declared > maxBody) {
      return next(tooLarge(`${limits.what} is larger than ${mb(limits.maxFileBytes)}; choose a smaller one`));
    }
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        switch (err.code) {
          case 'LIMIT_FILE_SIZE':
            return next(tooLarge(`${limits.what} is larger than ${mb(limits.maxFileBytes)}; choose a smaller one`));
          case 'LIMIT_PART_COUNT':
          case 'LIMIT_FIELD_COUNT':
          case 'LIMIT_FILE_COUNT':
            return next(tooLarge(`Send one file in the form field “${limits.field}” and at most ${limits.maxFields} other field${limits.maxFields === 1 ? '' : 's'}`));
          case 'LIMIT_FIELD_VALUE':
          case 'LIMIT_FIELD_KEY':
            return next(tooLarge(`A form field is too long (at most ${fieldBytes} bytes); send the file in “${limits.field}” and short text fields only`));
          default:
            return next(appError(`${limits.code}/bad_upload`, `Send one file in the form field “${limits.field}” (${err.message})`));
        }
      }
      next(appError(`${limits.code}/bad_upload`, `The upload could not be read; send it as multipart/form-data with the file in the field “${limits.field}”`));
    });
  };
}
