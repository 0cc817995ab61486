import { Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { SiteEntity } from './site.entity';

/** Free tags on a site (one row each, so lists can filter on them with an index). */
@Entity({ name: 'site_tag' })
@Index('ix_site_tag_tag', ['tag'])
export class SiteTagEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @PrimaryColumn({ type: 'varchar', length: 40 })
  tag!: string;

  @ManyToOne(() => SiteEntity, (s) => s.tags, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id' })
  site?: SiteEntity;
}
