import { DEVICE_CLAIM_FIELDS, type DeviceClaimField, type DeviceDto } from '@splitcase/contracts';
import { formatQuantity } from '@/lib/format';

/** A label claim as the person typed it ("5000 mAh"), else the stored value with its unit. */
export function claimText(device: DeviceDto, field: DeviceClaimField): string | null {
  const typed = device.entered[field];
  if (typed) return typed;
  const value = device[field];
  if (value === null) return null;
  return formatQuantity(value, DEVICE_CLAIM_FIELDS[field].unit);
}

/** The capacity on the label: charge and/or energy, as typed. */
export function labelCapacity(device: DeviceDto): string | null {
  const parts = [claimText(device, 'claimCapacityAh'), claimText(device, 'claimCapacityWh')].filter(Boolean);
  return parts.length ? parts.join(' · ') : null;
}
