// Every entity of the API. Add a new module's entities here (and create a migration).
import { AuditEntrySchema } from './audit/audit-entry.entity';
import { InvitationSchema } from './auth/invitation.entity';
import { ResetTokenSchema } from './auth/reset-token.entity';
import { DeviceSchema } from './devices/device.entity';
import { FindingSchema } from './findings/finding.entity';
import { OutboxMessageSchema } from './mail/outbox-message.entity';
import { MeasurementSchema } from './measurements/measurement.entity';
import { PartSchema } from './parts/part.entity';
import { CalloutSchema } from './photos/callout.entity';
import { PhotoSchema } from './photos/photo.entity';
import { ConverterSchema } from './power/converter.entity';
import { LoadSchema } from './power/load.entity';
import { PackSchema } from './power/pack.entity';
import { OperatingModeSchema } from './power/mode.entity';
import { ModeLoadSchema } from './power/mode-load.entity';
import { SettingSchema } from './settings/setting.entity';
import { CommentSchema } from './teardowns/comment.entity';
import { SuggestionDecisionSchema } from './teardowns/suggestion-decision.entity';
import { TeardownSchema } from './teardowns/teardown.entity';
import { UserSchema } from './users/user.entity';
import { CostModelSchema } from './cost/cost-model.entity';
import { PartPriceSchema } from './cost/part-price.entity';
import { RateTableSchema } from './cost/rate-table.entity';
import { BenchRunSchema } from './runs/bench-run.entity';
import { LineupSchema } from './lineups/lineup.entity';
import { LineupDeviceSchema } from './lineups/lineup-device.entity';

export const entities = [
  UserSchema,
  InvitationSchema,
  ResetTokenSchema,
  OutboxMessageSchema,
  AuditEntrySchema,
  DeviceSchema,
  TeardownSchema,
  CommentSchema,
  SuggestionDecisionSchema,
  PartSchema,
  PackSchema,
  ConverterSchema,
  LoadSchema,
  OperatingModeSchema,
  ModeLoadSchema,
  MeasurementSchema,
  PhotoSchema,
  CalloutSchema,
  FindingSchema,
  SettingSchema,
  PartPriceSchema,
  RateTableSchema,
  CostModelSchema,
  BenchRunSchema,
  LineupSchema,
  LineupDeviceSchema,
];
