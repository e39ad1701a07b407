namespace StringModes.Video;
