// Mantine's own preset gives our CSS modules rem(), light-dark() and the breakpoint mixins.
module.exports = {
  plugins: {
    'postcss-preset-mantine': {},
  },
};
