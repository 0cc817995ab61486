import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { UserStatus } from '@shared/users/user';

@Entity({ name: 'user' })
export class UserEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  /** Stored lower-cased; unique across the product (one person, one sign-in). */
  @Column({ type: 'varchar', length: 254, unique: true })
  email!: string;

  @Column({ type: 'varchar', length: 120, name: 'display_name' })
  displayName!: string;

  /** `scrypt$N$r$p$salt$hash`; null until an invited user sets a password. */
  @Column({ type: 'varchar', length: 255, nullable: true, name: 'password_hash' })
  passwordHash!: string | null;

  @Column({ type: 'enum', enum: ['active', 'invited', 'disabled'], default: 'invited' })
  status!: UserStatus;

  @Column({ type: 'datetime', precision: 3, nullable: true, name: 'last_sign_in_at' })
  lastSignInAt!: Date | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
