import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { ShareAccess } from '@shared/auth/roles';
import { OrganisationEntity } from '../../organisations/data/organisation.entity';
import { SiteEntity } from './site.entity';

/** A site shared with another organisation (a contractor firm or a utility) and the access it gets. */
@Entity({ name: 'site_share' })
@Index('ix_site_share_org', ['organisationId'])
export class SiteShareEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @PrimaryColumn({ type: 'int', unsigned: true, name: 'organisation_id' })
  organisationId!: number;

  @ManyToOne(() => SiteEntity, (s) => s.shares, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id' })
  site?: SiteEntity;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: OrganisationEntity;

  @Column({ type: 'enum', enum: ['contribute', 'read'] })
  access!: ShareAccess;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;
}
