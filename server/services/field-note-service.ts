import type { FieldNoteInput } from '../../shared/schemas/sightline';
import { AppError } from '../errors';
import { FieldNoteModel } from '../models/field-note';
import { UserModel } from '../models/user';
import { canChangeNote } from './access-policy';
import type { SightlineService } from './sightline-service';

const authorInclude = [{ model: UserModel, as: 'author', attributes: ['id', 'name'] }];

/** Field notes on a sightline: access, tide, hazard and general notes with author and date. */
export class FieldNoteService {
  constructor(private readonly sightlines: SightlineService) {}

  async list(user: UserModel, sightlineId: string): Promise<FieldNoteModel[]> {
    await this.sightlines.get(user, sightlineId, 'read');
    return FieldNoteModel.findAll({ where: { sightlineId }, include: authorInclude, order: [['createdAt', 'DESC']] });
  }

  async create(user: UserModel, sightlineId: string, input: FieldNoteInput): Promise<FieldNoteModel> {
    await this.sightlines.get(user, sightlineId, 'add-note');
    const note = await FieldNoteModel.create({ sightlineId, authorId: user.id, kind: input.kind, body: input.body });
    return (await FieldNoteModel.findByPk(note.id, { include: authorInclude }))!;
  }

  private async findChangeable(user: UserModel, sightlineId: string, noteId: string): Promise<FieldNoteModel> {
    const sightline = await this.sightlines.get(user, sightlineId, 'read');
    const note = await FieldNoteModel.findOne({ where: { id: noteId, sightlineId }, include: authorInclude });
    if (!note) throw AppError.notFound('No such note');
    if (!canChangeNote(user, sightline.viewerRole ?? 'outsider', note)) throw new AppError('forbidden', 'Only the author or the owner can change this note');
    return note;
  }

  async update(user: UserModel, sightlineId: string, noteId: string, input: FieldNoteInput): Promise<FieldNoteModel> {
    const note = await this.findChangeable(user, sightlineId, noteId);
    await note.update({ kind: input.kind, body: input.body });
    return note;
  }

  async remove(user: UserModel, sightlineId: string, noteId: string): Promise<void> {
    const note = await this.findChangeable(user, sightlineId, noteId);
    await note.destroy();
  }
}
