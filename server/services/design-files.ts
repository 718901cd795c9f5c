import { createHash, randomUUID } from 'node:crypto';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { DesignFileInfo, ImportPreview } from '../../shared/api';
import { parseDesign } from '../../shared/design';
import { designToDxf, designToSvg, ImportError, importOutline, type ImportResult } from '../../solver/io';
import { iso, queryRow, queryRows, run } from '../db/sql';
import { ApiError } from '../errors';
import type { Access } from './access';
import type { ActivityService } from './activity';
import type { BlobStore } from './blob-store';
import type { DesignService } from './designs';

export interface Upload {
  originalname: string;
  buffer: Buffer;
}

interface FileRow {
  id: number;
  design_id: number;
  kind: string;
  key: string;
  file_name: string;
  content_type: string;
  size: number;
  sha256: string;
  created_at: Date;
  created_by_name: string | null;
}

const TYPES = { svg: 'image/svg+xml', dxf: 'image/vnd.dxf' } as const;

function info(r: FileRow): DesignFileInfo {
  return { id: r.id, designId: r.design_id, kind: r.kind, fileName: r.file_name, contentType: r.content_type, size: r.size, sha256: r.sha256, createdAt: iso(r.created_at), createdBy: r.created_by_name };
}

/** A safe file name to keep and to send back in Content-Disposition: letters, digits, . _ - and spaces. */
export function safeFileName(name: string): string {
  const base = name.replace(/^.*[\\/]/, '').normalize('NFKC').replace(/[^\w.\- ]+/g, '_').replace(/^\.+/, '').slice(-120);
  return base || 'drawing';
}

/**
 * Drawings in and out: imports an uploaded SVG or DXF into a new design and keeps the original with it, serves
 * the original back, exports the outline, and deletes a design with every object it owns.
 */
export class DesignFileService {
  constructor(
    private readonly orm: MikroORM,
    private readonly blobs: BlobStore,
    private readonly activity: ActivityService,
    private readonly designs: DesignService,
  ) {}

  /** Parses a drawing; a refusal becomes 400 (413 for size) naming the file. */
  parse(upload: Upload, options: { scale?: number; name?: string }): ImportResult {
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(upload.buffer);
    } catch {
      throw new ApiError('invalid', `${safeFileName(upload.originalname)}: the file is not text (SVG and ASCII DXF are text files)`, 'file');
    }
    try {
      return importOutline(upload.originalname, text, options);
    } catch (error) {
      if (error instanceof ImportError) {
        throw new ApiError(error.code === 'too-large' ? 'too-large' : 'invalid', `${safeFileName(upload.originalname)}: ${error.message}`, 'file');
      }
      throw error;
    }
  }

  preview(upload: Upload, options: { scale?: number; name?: string }): ImportPreview {
    const r = this.parse(upload, options);
    return { document: r.design, report: r.report };
  }

  /**
   * Creates a design from a drawing and keeps the original: the object is stored first, then the design, its file
   * row and the activity line in one transaction; when that fails the object is removed again, so a failed
   * upload leaves neither rows nor objects.
   */
  async importDesign(access: Access, upload: Upload, options: { scale?: number; name?: string }) {
    const parsed = this.parse(upload, options);
    const fileName = safeFileName(upload.originalname);
    const format = parsed.report.format;
    const key = `originals/${randomUUID()}.${format}`;
    const sha256 = createHash('sha256').update(upload.buffer).digest('hex');
    await this.blobs.put(key, upload.buffer, TYPES[format]);
    let designId: number;
    try {
      designId = await this.orm.em.fork().transactional(async (em) => {
        const name = parsed.design.name.trim() || 'Imported outline';
        const row = await queryRow<{ id: number }>(
          em,
          `insert into designs (workspace_id, name, document, version, review_state, created_at, created_by_id, updated_at, updated_by_id)
           values (?, ?, ?::json, 1, 'draft', now(), ?, now(), ?) returning id`,
          [access.workspaceId, name, JSON.stringify(parsed.design), access.userId, access.userId],
        );
        await run(
          em,
          `insert into design_files (design_id, kind, key, file_name, content_type, size, sha256, created_at, created_by_id)
           values (?, 'original', ?, ?, ?, ?, ?, now(), ?)`,
          [row!.id, key, fileName, TYPES[format], upload.buffer.length, sha256, access.userId],
        );
        const s = parsed.report.skipped.length;
        await this.activity.record(em, {
          workspaceId: access.workspaceId, actorId: access.userId, designId: row!.id, kind: 'design.imported',
          message: `imported "${name}" from ${fileName}${s ? ` (${s} thing${s === 1 ? '' : 's'} skipped)` : ''}`,
        });
        return row!.id;
      });
    } catch (error) {
      await this.blobs.delete(key).catch(() => undefined);
      throw error;
    }
    return { design: await this.designs.get(access, designId), report: parsed.report };
  }

  async list(designId: number): Promise<DesignFileInfo[]> {
    const rows = await queryRows<FileRow>(
      this.orm.em.fork(),
      `select f.*, u.name as created_by_name from design_files f left join users u on u.id = f.created_by_id
       where f.design_id = ? order by f.created_at desc, f.id desc`,
      [designId],
    );
    return rows.map(info);
  }

  /** The design a file belongs to (for the role check), or 404. */
  async designOf(fileId: number): Promise<number> {
    const r = await queryRow<{ design_id: number }>(this.orm.em.fork(), 'select design_id from design_files where id = ?', [fileId]);
    if (!r) throw new ApiError('not-found', 'No such file');
    return r.design_id;
  }

  async download(fileId: number): Promise<{ file: DesignFileInfo; bytes: Buffer }> {
    const r = await queryRow<FileRow>(this.orm.em.fork(), 'select f.*, null as created_by_name from design_files f where f.id = ?', [fileId]);
    if (!r) throw new ApiError('not-found', 'No such file');
    const bytes = await this.blobs.get(r.key);
    if (!bytes) throw new ApiError('not-found', 'The stored file is missing');
    return { file: info(r), bytes };
  }

  async outline(designId: number, format: 'svg' | 'dxf'): Promise<{ text: string; name: string }> {
    const r = await queryRow<{ document: unknown; name: string }>(this.orm.em.fork(), 'select document, name from designs where id = ?', [designId]);
    if (!r) throw new ApiError('not-found', 'No such design');
    const parsed = parseDesign(r.document);
    if (!parsed.ok) throw new ApiError('invalid', 'The design document is not valid, so it has no outline to export');
    if (parsed.design.shapes.length === 0) throw new ApiError('invalid', 'The design has no shapes to export');
    return { text: format === 'svg' ? designToSvg(parsed.design) : designToDxf(parsed.design), name: safeFileName(r.name) };
  }

  /**
   * Deletes a design with its revisions, runs, comments and files (rows by cascade, in one transaction with the
   * activity line), then the objects those rows named: uploaded originals and run field blobs.
   */
  async deleteDesign(access: Access, designId: number): Promise<void> {
    const keys = await this.orm.em.fork().transactional(async (em) => {
      const d = await queryRow<{ name: string }>(em, 'select name from designs where id = ? for update', [designId]);
      if (!d) throw new ApiError('not-found', 'No such design');
      const owned = await queryRows<{ key: string }>(
        em,
        `select key from design_files where design_id = ?
         union all select x.blob_key as key from runs x join revisions r on r.id = x.revision_id where r.design_id = ? and x.blob_key is not null`,
        [designId, designId],
      );
      await run(em, 'delete from designs where id = ?', [designId]);
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, designId: null, kind: 'design.deleted', message: `deleted the design "${d.name}"` });
      return owned.map((o) => o.key);
    });
    const failed: string[] = [];
    for (const key of keys) await this.blobs.delete(key).catch(() => failed.push(key));
    if (failed.length) console.error(`[storage] could not remove ${failed.length} object(s) of deleted design ${designId}: ${failed.join(', ')}`);
  }
}
