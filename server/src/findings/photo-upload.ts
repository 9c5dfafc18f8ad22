import {
  BadRequestException,
  Injectable,
  PayloadTooLargeException,
  type CallHandler,
  type ExecutionContext,
  type NestInterceptor,
} from '@nestjs/common';
import type { MulterModuleOptions } from '@nestjs/platform-express';
import { memoryStorage } from 'multer';
import { catchError, throwError, type Observable } from 'rxjs';
import { MAX_FINDING_PHOTO_BYTES, MAX_FINDING_PHOTOS } from '@baytime/shared';

/** What a photo looks like once multer has read it into memory. */
export interface UploadedPhoto {
  buffer: Buffer;
  size: number;
  originalname: string;
}

interface CountingRequest {
  photosSeen?: number;
}

export const MAX_PHOTO_MB = MAX_FINDING_PHOTO_BYTES / (1024 * 1024);

/**
 * Photos stay in memory until every one of them passed its checks: a refused upload leaves nothing on
 * disk. The filter counts the files so a size error can say which photo was too large.
 */
export const photoUploadOptions: MulterModuleOptions = {
  storage: memoryStorage(),
  limits: { fileSize: MAX_FINDING_PHOTO_BYTES, files: MAX_FINDING_PHOTOS },
  fileFilter: (request: CountingRequest, _file, accept) => {
    request.photosSeen = (request.photosSeen ?? 0) + 1;
    accept(null, true);
  },
};

/** Turns multer's limit errors into answers that say which photo and what to do. */
@Injectable()
export class PhotoUploadErrors implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    const request = context.switchToHttp().getRequest<CountingRequest>();
    return next
      .handle()
      .pipe(catchError((error: unknown) => throwError(() => explain(error, request.photosSeen ?? 0))));
  }
}

function explain(error: unknown, photosSeen: number): unknown {
  const cause = (error as { cause?: { code?: unknown; field?: unknown } } | null)?.cause;
  switch (cause?.code) {
    case 'LIMIT_FILE_SIZE':
      return new PayloadTooLargeException(`Photo ${photosSeen} is larger than ${MAX_PHOTO_MB} MB`);
    case 'LIMIT_FILE_COUNT':
      return new BadRequestException(`Up to ${MAX_FINDING_PHOTOS} photos per finding`);
    case 'LIMIT_UNEXPECTED_FILE':
      return new BadRequestException(
        cause.field === 'photos'
          ? `Up to ${MAX_FINDING_PHOTOS} photos per finding`
          : 'Send the photos in the field named photos',
      );
    default:
      return error;
  }
}
