import { enUS, type NLocale } from 'naive-ui'

// The library's own English with its stock prompts replaced: an empty field says nothing rather
// than "Please Input", and a list says what to do. Fields that need a prompt set their own.
export const appLocale: NLocale = {
  ...enUS,
  Input: { ...enUS.Input, placeholder: '' },
  InputNumber: { ...enUS.InputNumber, placeholder: '' },
  Select: { ...enUS.Select, placeholder: 'Choose one' },
  Cascader: { ...enUS.Cascader, placeholder: 'Choose one' },
  TimePicker: { ...enUS.TimePicker, placeholder: 'Choose a time' },
  DatePicker: { ...enUS.DatePicker, datePlaceholder: 'Choose a date' },
}
