// Every entity class the ORM knows. Add a new entity here (and create a migration).
import { Company } from '../companies/company.entity';
import { OutboxMail } from '../mail/outbox-mail.entity';
import { Membership } from '../users/membership.entity';
import { User } from '../users/user.entity';

export const entities = [Company, User, Membership, OutboxMail];
