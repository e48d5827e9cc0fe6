import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { ColumnMap } from '../../shared/log/column-map';
import { Team } from '../teams/team.entity';

/** A team's saved column map for a log layout. */
@Entity('import_presets')
@Index('idx_import_presets_team_name', ['teamId', 'name'], { unique: true })
export class ImportPreset {
  @PrimaryColumn('text') id!: string;
  @Column('text') teamId!: string;
  @ManyToOne(() => Team, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'teamId' })
  team?: Team;
  @Column('text') name!: string;
  @Column('simple-json') columnMap!: ColumnMap;
  @Column('text') createdById!: string;
  @Column('integer') createdAt!: number;
  @Column('integer') updatedAt!: number;
  /** Adds one on every write; `If-Match` names it. */
  @Column('integer', { default: 1 }) version!: number;
}
