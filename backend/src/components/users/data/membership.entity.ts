import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '@shared/auth/roles';
import { OrganisationEntity } from '../../organisations/data/organisation.entity';
import { UserEntity } from './user.entity';

/** A user's role in one organisation. */
@Entity({ name: 'membership' })
@Index('uq_membership_user_org', ['userId', 'organisationId'], { unique: true })
export class MembershipEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'user_id' })
  userId!: number;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user?: UserEntity;

  @Column({ type: 'int', unsigned: true, name: 'organisation_id' })
  organisationId!: number;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: OrganisationEntity;

  @Column({ type: 'enum', enum: ['admin', 'manager', 'contractor', 'auditor'] })
  role!: Role;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;
}
