import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';

/** The ETAF a site's ordinance allows; no row means MWELO's value for the site's kind. */
@Entity({ name: 'site_etaf_setting' })
export class SiteEtafSettingEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @Column({ type: 'double', name: 'allowed_etaf' })
  allowedEtaf!: number;

  @Column({ type: 'varchar', length: 20 })
  basis!: string;

  @Column({ type: 'int', unsigned: true, name: 'updated_by', nullable: true })
  updatedBy!: number | null;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
