import { sequelize } from '../db/sequelize';
import { AuditEvent } from './AuditEvent';
import { Ball } from './Ball';
import { CalibrationFit } from './CalibrationFit';
import { BallModel } from './BallModel';
import { Pattern } from './Pattern';
import { SurfaceEvent } from './SurfaceEvent';
import { BowlerProfile } from './BowlerProfile';
import { Center } from './Center';
import { Condition } from './Condition';
import { Follow } from './Follow';
import { Trial } from './Trial';
import { League } from './League';
import { Lane } from './Lane';
import { MailOutbox } from './MailOutbox';
import { EmailVerification } from './EmailVerification';
import { PasswordReset } from './PasswordReset';
import { Upload } from './Upload';
import { User } from './User';
import { Order } from './Order';
import { OrderEvent } from './OrderEvent';
import { Payment } from './Payment';
import { PaymentEvent } from './PaymentEvent';
import { ShopService } from './ShopService';
import { Annotation } from './Annotation';
import { BowlingSession } from './BowlingSession';
import { CoachLink } from './CoachLink';
import { Plan } from './Plan';
import { Shot } from './Shot';

// Every model is initialised and every association declared here, once.
User.initModel(sequelize);
BowlerProfile.initModel(sequelize);
PasswordReset.initModel(sequelize);
EmailVerification.initModel(sequelize);
AuditEvent.initModel(sequelize);
BallModel.initModel(sequelize);
Ball.initModel(sequelize);
SurfaceEvent.initModel(sequelize);
Pattern.initModel(sequelize);
Center.initModel(sequelize);
Lane.initModel(sequelize);
Condition.initModel(sequelize);
Follow.initModel(sequelize);
Trial.initModel(sequelize);
League.initModel(sequelize);
MailOutbox.initModel(sequelize);
Upload.initModel(sequelize);
ShopService.initModel(sequelize);
Order.initModel(sequelize);
OrderEvent.initModel(sequelize);
Payment.initModel(sequelize);
PaymentEvent.initModel(sequelize);
BowlingSession.initModel(sequelize);
Shot.initModel(sequelize);
CoachLink.initModel(sequelize);
Plan.initModel(sequelize);
Annotation.initModel(sequelize);
CalibrationFit.initModel(sequelize);

User.hasOne(BowlerProfile, { foreignKey: 'userId', as: 'profile' });
BowlerProfile.belongsTo(User, { foreignKey: 'userId', as: 'user' });
User.hasMany(PasswordReset, { foreignKey: 'userId' });
PasswordReset.belongsTo(User, { foreignKey: 'userId' });
User.hasMany(EmailVerification, { foreignKey: 'userId' });
EmailVerification.belongsTo(User, { foreignKey: 'userId' });
AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
User.hasMany(Ball, { foreignKey: 'ownerId' });
Ball.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
Ball.belongsTo(BallModel, { foreignKey: 'ballModelId', as: 'model' });
BallModel.hasMany(Ball, { foreignKey: 'ballModelId' });
Ball.hasMany(SurfaceEvent, { foreignKey: 'ballId', as: 'surfaceEvents' });
SurfaceEvent.belongsTo(Ball, { foreignKey: 'ballId' });
Pattern.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
Center.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
Center.hasMany(Lane, { foreignKey: 'centerId', as: 'lanes' });
Lane.belongsTo(Center, { foreignKey: 'centerId' });
Center.hasMany(Condition, { foreignKey: 'centerId' });
Condition.belongsTo(Center, { foreignKey: 'centerId', as: 'center' });
Condition.belongsTo(Pattern, { foreignKey: 'patternId' });
Follow.belongsTo(User, { foreignKey: 'userId', as: 'user' });
Follow.belongsTo(Center, { foreignKey: 'centerId', as: 'center' });
User.hasMany(Follow, { foreignKey: 'userId' });
Center.hasMany(Follow, { foreignKey: 'centerId' });
Upload.belongsTo(User, { foreignKey: 'ownerId' });
Ball.belongsTo(Upload, { foreignKey: 'photoUploadId', as: 'photo' });
ShopService.belongsTo(Center, { foreignKey: 'centerId', as: 'center' });
Order.belongsTo(User, { foreignKey: 'userId', as: 'bowler' });
Order.belongsTo(Center, { foreignKey: 'centerId', as: 'center' });
Order.hasMany(OrderEvent, { foreignKey: 'orderId', as: 'events' });
Order.hasMany(Payment, { foreignKey: 'orderId', as: 'payments' });
Payment.belongsTo(Order, { foreignKey: 'orderId', as: 'order' });
BowlingSession.belongsTo(User, { foreignKey: 'userId', as: 'owner' });
BowlingSession.belongsTo(Center, { foreignKey: 'centerId', as: 'center' });
BowlingSession.hasMany(Shot, { foreignKey: 'sessionId', as: 'shots' });
Shot.belongsTo(BowlingSession, { foreignKey: 'sessionId', as: 'session' });
Shot.belongsTo(Ball, { foreignKey: 'ballId', as: 'ball' });
CoachLink.belongsTo(User, { foreignKey: 'coachId', as: 'coach' });
CoachLink.belongsTo(User, { foreignKey: 'studentId', as: 'student' });
Plan.belongsTo(User, { foreignKey: 'coachId', as: 'coach' });
Plan.belongsTo(Ball, { foreignKey: 'ballId', as: 'ball' });
Annotation.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
BowlingSession.hasMany(Annotation, { foreignKey: 'sessionId', as: 'annotations' });

export {
  sequelize,
  Annotation,
  BowlingSession,
  CoachLink,
  Plan,
  Shot,
  AuditEvent,
  Ball,
  BallModel,
  BowlerProfile,
  Center,
  Condition,
  Follow,
  Trial,
  League,
  Lane,
  MailOutbox,
  EmailVerification,
  PasswordReset,
  Pattern,
  SurfaceEvent,
  Upload,
  User,
};
export { Order, OrderEvent, Payment, PaymentEvent, ShopService };
export { CalibrationFit };
