// QC photos taken on a station's tablet, and the artwork picture the tablet shows with a tray.
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { scansRepository } from '../repositories/scans.repository';
import { usersRepository } from '../repositories/users.repository';
import { AppError, badInput, notFound } from '../errors';
import { putFile, readFile } from '../lib/file-store';
import { decodeUpload } from '../lib/upload-decode';
import { checkUploadName } from '../lib/uploads';
import { refusalText } from '@shared/domain/scan-messages';
import { parseTravellerCode } from '@shared/domain/traveller-code';

export const scanPhotosService = {
  /**
   * A QC photo taken on the tablet (already resized there), kept with the tray. Its type is
   * read from its content and the picture decoded in full, like a proof; what the browser
   * declares is ignored. The operator named by a tablet with nobody signed in must be an active user.
   */
  async addPhoto(
    deps: AppDeps,
    input: { code: string; eventId?: string; file: { buffer: Buffer; originalname?: string; size: number }; operatorId?: string },
    userId: string | null,
  ) {
    if (input.file.size === 0 || input.file.buffer.length === 0) throw badInput('The photo is empty: take it again.', undefined, 'empty_file');
    const name = checkUploadName(input.file.originalname || 'photo.jpg');
    let createdBy = userId;
    if (!createdBy && input.operatorId) {
      const operator = usersRepository.byId(deps.db, input.operatorId);
      if (!operator || !operator.active)
        throw badInput('The operator named with this photo is not an active user. Sign in again and retake it.', undefined, 'unknown_operator');
      createdBy = operator.id;
    }
    const parsed = parseTravellerCode(input.code);
    const tray = parsed ? scansRepository.traysByNumbers(deps.db, [parsed.number])[0] : undefined;
    if (!tray) throw new AppError(404, 'unknown_tray', refusalText('unknown_tray'));
    const { mime } = await decodeUpload(input.file.buffer, name, ['image/jpeg', 'image/png']);
    const { hash, sizeBytes } = putFile(deps.env.dataDir, input.file.buffer);
    const id = crypto.randomUUID();
    scansRepository.insertAttachment(deps.db, {
      id,
      trayId: tray.id,
      eventId: input.eventId ?? null,
      fileHash: hash,
      mime,
      sizeBytes,
      createdBy,
      createdAt: deps.now(),
    });
    return { id, trayId: tray.id, hash };
  },

  /** The artwork picture of an order (its newest approved proof, when that is an image). */
  artwork(deps: AppDeps, orderId: string) {
    const proof = scansRepository.artworkProofs(deps.db, [orderId])[0];
    const content = proof ? readFile(deps.env.dataDir, proof.fileHash) : null;
    if (!proof || !content) throw notFound('That artwork');
    return { content, mime: proof.mime };
  },
};
