import { Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { SiteEntity } from '../../sites/data/site.entity';
import { ApiKeyEntity } from './api-key.entity';

/** The sites one API key may upload to. */
@Entity({ name: 'api_key_site' })
export class ApiKeySiteEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'api_key_id' })
  apiKeyId!: number;

  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @ManyToOne(() => ApiKeyEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'api_key_id', foreignKeyConstraintName: 'fk_api_key_site_key' })
  apiKey?: ApiKeyEntity;

  @ManyToOne(() => SiteEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'fk_api_key_site_site' })
  site?: SiteEntity;
}
