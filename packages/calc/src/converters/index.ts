export { buckDutyCycle, boostDutyCycle, buckDutyCycleWithLosses, boostDutyCycleWithLosses, conversionLossWatts, converterInputWatts } from './duty-cycle';
export { powerBankOutputAh } from './power-bank';
export { type UsbPortLevel, USB_PORT_LEVELS, USB_BUS_VOLTS, usbChargeInput } from './usb';
