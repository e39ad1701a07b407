namespace StringModes.Reporting;
