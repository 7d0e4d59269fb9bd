import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A mail caught by the built-in fake SMTP server (only when SMTP_URL is unset). */
@Entity('mail_message')
export class MailMessage {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('varchar', { length: 400 }) sender: string;
  @Column('varchar', { length: 2000 }) recipients: string;
  @Column('varchar', { length: 400 }) subject: string;
  @Column('text') text: string;
  @Column('text', { nullable: true }) html: string | null;
  @CreateDateColumn({ type: 'datetime' }) receivedAt: Date;
}
