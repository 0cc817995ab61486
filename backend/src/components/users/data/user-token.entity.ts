import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { UserEntity } from './user.entity';

export type TokenPurpose = 'invite' | 'reset';

/** One-time link for an invitation or a password reset; only the token's SHA-256 is stored. */
@Entity({ name: 'user_token' })
export class UserTokenEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'user_id' })
  userId!: number;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user?: UserEntity;

  @Column({ type: 'enum', enum: ['invite', 'reset'] })
  purpose!: TokenPurpose;

  @Column({ type: 'char', length: 64, unique: true, name: 'token_hash' })
  tokenHash!: string;

  @Column({ type: 'datetime', precision: 3, name: 'expires_at' })
  expiresAt!: Date;

  @Column({ type: 'datetime', precision: 3, nullable: true, name: 'used_at' })
  usedAt!: Date | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;
}
