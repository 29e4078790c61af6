import type { AccessorySpec } from '../schemas/estimate'
import type { LibraryAccessory } from './types'

function accessory(id: string, part: AccessorySpec): LibraryAccessory {
  return { id, label: part.label, part }
}

// USB 2.0 specification: VBUS 4.75–5.25 V at the device.
const USB_MIN_V = 4.75
const USB_MAX_V = 5.25
// Datasheet class: small synchronous step-down modules reach 85–92 % at these loads.
const BUCK_EFFICIENCY = 0.88

// Typical draws and input ranges of generic accessories (datasheet class of the common boards and
// adapters, or from memory where marked). Anything on USB is fed through a 5 V step-down: no pack
// sits inside the USB window.
export const libraryAccessories: readonly LibraryAccessory[] = [
  accessory('acc-bluetooth-preamp-usb', {
    label: 'Bluetooth receiver with preamp (USB 5 V)',
    powerW: 0.6, // datasheet class: about 120 mA at 5 V while streaming
    inputMinV: USB_MIN_V,
    inputMaxV: USB_MAX_V,
    feed: 'buck',
    outputV: 5,
    efficiency: BUCK_EFFICIENCY,
  }),
  accessory('acc-bluetooth-preamp-wide', {
    label: 'Bluetooth receiver with preamp (8–24 V input)',
    powerW: 1.2, // datasheet class: 50–100 mA at 12 V with the preamp stage
    inputMinV: 8, // datasheet class: on-board regulator, 8–24 V
    inputMaxV: 24,
    feed: 'direct',
  }),
  accessory('acc-wireless-mic-receiver', {
    label: 'Wireless microphone receiver (12 V input)',
    powerW: 3, // datasheet class: 250 mA at 12 V
    inputMinV: 11, // datasheet class: 12–15 V adapters; about 11 V is the lowest that works
    inputMaxV: 15,
    feed: 'direct',
  }),
  accessory('acc-small-mixer', {
    label: 'Small mixer, 4 channels (12 V input)',
    powerW: 4, // from memory: small mixers draw 300–400 mA at 12 V
    inputMinV: 10.5,
    inputMaxV: 15,
    feed: 'direct',
  }),
  accessory('acc-dsp-board', {
    label: 'DSP board, 2 in 4 out (8–15 V input)',
    powerW: 2.5, // datasheet class: 200 mA at 12 V
    inputMinV: 8,
    inputMaxV: 15,
    feed: 'direct',
  }),
  accessory('acc-led-strip-12v', {
    label: 'LED strip light, 12 V, 1 m',
    powerW: 4.8, // common practice: 60 LEDs per metre of 3528 strip draw 4.8 W per metre
    inputMinV: 10.8, // common practice: 12 V strips within ±10 %
    inputMaxV: 13.2,
    feed: 'direct',
  }),
  accessory('acc-usb-phone', {
    label: 'Phone or music player charging (USB 5 V, 1 A)',
    powerW: 5, // USB 2.0 charging at 1 A
    inputMinV: USB_MIN_V,
    inputMaxV: USB_MAX_V,
    feed: 'buck',
    outputV: 5,
    efficiency: BUCK_EFFICIENCY,
  }),
  accessory('acc-usb-tablet', {
    label: 'Tablet playing music (USB 5 V, 2 A)',
    powerW: 10, // common practice: 2 A USB adapters for tablets
    inputMinV: USB_MIN_V,
    inputMaxV: USB_MAX_V,
    feed: 'buck',
    outputV: 5,
    efficiency: BUCK_EFFICIENCY,
  }),
  accessory('acc-usb-lamp', {
    label: 'USB reading lamp (5 V)',
    powerW: 1, // from memory: small USB LED lamps draw about 200 mA
    inputMinV: USB_MIN_V,
    inputMaxV: USB_MAX_V,
    feed: 'buck',
    outputV: 5,
    efficiency: BUCK_EFFICIENCY,
  }),
]
