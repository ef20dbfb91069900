import { sequelize } from '../db/sequelize';
import { AuditEvent } from './AuditEvent';
import { BowlerProfile } from './BowlerProfile';
import { PasswordReset } from './PasswordReset';
import { User } from './User';

// Every model is initialised and every association declared here, once.
User.initModel(sequelize);
BowlerProfile.initModel(sequelize);
PasswordReset.initModel(sequelize);
AuditEvent.initModel(sequelize);

User.hasOne(BowlerProfile, { foreignKey: 'userId', as: 'profile' });
BowlerProfile.belongsTo(User, { foreignKey: 'userId', as: 'user' });
User.hasMany(PasswordReset, { foreignKey: 'userId' });
PasswordReset.belongsTo(User, { foreignKey: 'userId' });
AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });

export { sequelize, AuditEvent, BowlerProfile, PasswordReset, User };
