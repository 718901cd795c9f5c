import type { Request, Response } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { MAP_QUANTITY_NAMES, RUN_EXPORT_FORMATS } from '../../shared/api';
import type { ServerConfig } from '../config';
import { ApiError } from '../errors';
import type { Services } from '../services';
import { idParam, parse, type ApiRoutes } from './define';

const importFields = z.object({
  /** Metres per drawing unit; empty means "from the file". */
  scale: z.preprocess((v) => (v === '' || v === undefined ? undefined : Number(v)), z.number().positive().max(1000).optional()),
  name: z.string().trim().max(200).optional(),
  preview: z.enum(['0', '1', 'true', 'false']).optional(),
});

const outlineQuery = z.object({ format: z.enum(['svg', 'dxf']) });
const exportQuery = z.object({ format: z.enum(RUN_EXPORT_FORMATS), quantity: z.enum(MAP_QUANTITY_NAMES).default('potential') });

/** Attachment headers for anything we send back as a file; uploaded drawings also get a sandboxing CSP. */
function attachment(res: Response, name: string, type: string): void {
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  res.setHeader('Content-Type', type);
  res.setHeader('Content-Disposition', `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`);
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Content-Security-Policy', "sandbox; default-src 'none'");
}

/**
 * Files in and out: import a drawing into a new design (or preview it), the originals kept with a design,
 * outline exports, run exports and the PDF report, and deleting a design with its objects.
 */
export function fileRoutes(api: ApiRoutes, s: Services, config: ServerConfig): void {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: config.uploadLimit, files: 1, fields: 8, fieldSize: 1024, parts: 10 },
    fileFilter: (_req, file, cb) => {
      if (/\.(svg|dxf)$/i.test(file.originalname)) cb(null, true);
      else cb(new ApiError('invalid', `"${file.originalname.slice(0, 100)}" is neither .svg nor .dxf; outlines are imported from SVG or DXF files`, 'file'));
    },
  }).single('file');
  const receive = (req: Request, res: Response) =>
    new Promise<void>((resolve, reject) =>
      upload(req, res, (err: unknown) => {
        if (!err) return resolve();
        if (err instanceof multer.MulterError) {
          if (err.code === 'LIMIT_FILE_SIZE') return reject(new ApiError('too-large', `The drawing is larger than ${Math.round(config.uploadLimit / 1024)} KiB`, 'file'));
          return reject(new ApiError('invalid', `The upload was refused: ${err.message}`, err.field ?? 'file'));
        }
        reject(err);
      }),
    );

  api.user('post', '/workspaces/:wid/designs/import', async (req, res, user) => {
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'editor');
    await receive(req, res);
    const fields = parse(importFields, req.body ?? {}, 'The form');
    if (!req.file) throw new ApiError('invalid', 'Send the drawing as multipart/form-data in a field named "file"', 'file');
    const options = { scale: fields.scale, name: fields.name };
    if (fields.preview === '1' || fields.preview === 'true') {
      res.json(s.files.preview(req.file, options));
      return;
    }
    res.status(201).json(await s.files.importDesign(access, req.file, options));
  });

  api.user('delete', '/designs/:id', async (req, res, user) => {
    const id = idParam(req, 'id');
    const access = await s.access.design(user.id, id, 'editor');
    await s.files.deleteDesign(access, id);
    res.status(204).end();
  });

  api.user('get', '/designs/:id/files', async (req, res, user) => {
    const id = idParam(req, 'id');
    await s.access.design(user.id, id, 'viewer');
    res.json(await s.files.list(id));
  });

  // The original exactly as uploaded (it passed the import's checks: no script, handler or external reference),
  // only ever as an attachment in a sandbox, never inline.
  api.user('get', '/files/:id', async (req, res, user) => {
    const id = idParam(req, 'id');
    await s.access.design(user.id, await s.files.designOf(id), 'viewer');
    const { file, bytes } = await s.files.download(id);
    attachment(res, file.fileName, file.contentType);
    res.send(bytes);
  });

  api.user('get', '/designs/:id/outline', async (req, res, user) => {
    const q = parse(outlineQuery, req.query, 'The query');
    const id = idParam(req, 'id');
    await s.access.design(user.id, id, 'viewer');
    const out = await s.files.outline(id, q.format);
    attachment(res, `${out.name} outline.${q.format}`, q.format === 'svg' ? 'image/svg+xml' : 'image/vnd.dxf');
    res.send(out.text);
  });

  api.user('get', '/runs/:id/export', async (req, res, user) => {
    const q = parse(exportQuery, req.query, 'The query');
    const id = idParam(req, 'id');
    await s.access.run(user.id, id, 'viewer');
    const out = await s.exports.file(id, q.format, q.quantity);
    attachment(res, out.name, out.type);
    res.send(out.body);
  });

  api.user('get', '/runs/:id/report.pdf', async (req, res, user) => {
    const id = idParam(req, 'id');
    await s.access.run(user.id, id, 'viewer');
    const out = await s.exports.report(id);
    attachment(res, out.name, 'application/pdf');
    res.send(out.body);
  });
}
