import { enUS, type NLocale } from 'naive-ui';

// naive-ui's English strings, with its generic "Please Input" / "Please Select" placeholders
// removed (an empty box with a real label reads better than a placeholder that says nothing)
// and its remaining words in sentence case, as the rest of Rindwise writes them.
export const rindwiseLocale: NLocale = {
  ...enUS,
  Input: { ...enUS.Input, placeholder: '' },
  InputNumber: { ...enUS.InputNumber, placeholder: '' },
  Select: { ...enUS.Select, placeholder: 'Choose' },
  Cascader: { ...enUS.Cascader, placeholder: 'Choose' },
  TimePicker: { ...enUS.TimePicker, placeholder: 'Time' },
  DatePicker: {
    ...enUS.DatePicker,
    selectTime: 'Choose a time',
    selectDate: 'Choose a date',
    datePlaceholder: 'Date',
    datetimePlaceholder: 'Date and time',
    monthPlaceholder: 'Month',
    yearPlaceholder: 'Year',
    quarterPlaceholder: 'Quarter',
    weekPlaceholder: 'Week',
    startDatePlaceholder: 'From',
    endDatePlaceholder: 'To',
    startDatetimePlaceholder: 'From',
    endDatetimePlaceholder: 'To',
    startMonthPlaceholder: 'From',
    endMonthPlaceholder: 'To',
  },
};
