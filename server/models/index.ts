import { sequelize } from '../db/sequelize';
import { AuditEvent } from './AuditEvent';
import { Ball } from './Ball';
import { BallModel } from './BallModel';
import { Pattern } from './Pattern';
import { SurfaceEvent } from './SurfaceEvent';
import { BowlerProfile } from './BowlerProfile';
import { PasswordReset } from './PasswordReset';
import { User } from './User';

// Every model is initialised and every association declared here, once.
User.initModel(sequelize);
BowlerProfile.initModel(sequelize);
PasswordReset.initModel(sequelize);
AuditEvent.initModel(sequelize);
BallModel.initModel(sequelize);
Ball.initModel(sequelize);
SurfaceEvent.initModel(sequelize);
Pattern.initModel(sequelize);

User.hasOne(BowlerProfile, { foreignKey: 'userId', as: 'profile' });
BowlerProfile.belongsTo(User, { foreignKey: 'userId', as: 'user' });
User.hasMany(PasswordReset, { foreignKey: 'userId' });
PasswordReset.belongsTo(User, { foreignKey: 'userId' });
AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
User.hasMany(Ball, { foreignKey: 'ownerId' });
Ball.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
Ball.belongsTo(BallModel, { foreignKey: 'ballModelId', as: 'model' });
BallModel.hasMany(Ball, { foreignKey: 'ballModelId' });
Ball.hasMany(SurfaceEvent, { foreignKey: 'ballId', as: 'surfaceEvents' });
SurfaceEvent.belongsTo(Ball, { foreignKey: 'ballId' });
Pattern.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });

export { sequelize, AuditEvent, Ball, BallModel, BowlerProfile, PasswordReset, Pattern, SurfaceEvent, User };
