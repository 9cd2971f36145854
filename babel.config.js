// Expo's own preset. Metro would use it without this file; jest-expo's web preset needs the file to find it.
module.exports = function (api) {
  api.cache(true);
  return { presets: ['babel-preset-expo'] };
};
