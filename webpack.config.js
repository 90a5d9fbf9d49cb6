/* eslint-disable no-undef */
// Builds dist/: functions.json (from functions.ts JSDoc), the functions and taskpane bundles
// sharing one runtime page (taskpane.html), the icons and the manifest.
const path = require('path');
const CustomFunctionsMetadataPlugin = require('custom-functions-metadata-plugin');
const HtmlWebpackPlugin = require('html-webpack-plugin');
const CopyWebpackPlugin = require('copy-webpack-plugin');

const DEV_ORIGIN = 'https://localhost:3000';
// Where the production add-in is served; set PROTIC_ORIGIN when deploying.
const PROD_ORIGIN = (process.env.PROTIC_ORIGIN || 'https://protic.example.invalid').replace(/\/$/, '');

/** Replaces the development origin in the help links of functions.json for a production build. */
class ProductionUrlsPlugin {
  apply(compiler) {
    compiler.hooks.thisCompilation.tap('ProductionUrlsPlugin', (compilation) => {
      compilation.hooks.processAssets.tap({ name: 'ProductionUrlsPlugin', stage: compiler.webpack.Compilation.PROCESS_ASSETS_STAGE_OPTIMIZE }, (assets) => {
        const json = assets['functions.json'];
        if (json) compilation.updateAsset('functions.json', new compiler.webpack.sources.RawSource(json.source().toString().split(DEV_ORIGIN).join(PROD_ORIGIN)));
      });
    });
  }
}

module.exports = (env, argv) => {
  const production = argv.mode === 'production';
  return {
    devtool: production ? false : 'source-map',
    entry: {
      functions: './src/functions/functions.ts',
      taskpane: './src/taskpane/taskpane.ts',
    },
    output: { path: path.resolve(__dirname, 'dist'), filename: '[name].js', clean: true },
    resolve: { extensions: ['.ts', '.js'] },
    module: { rules: [{ test: /\.ts$/, exclude: /node_modules/, use: { loader: 'ts-loader', options: { transpileOnly: true } } }] },
    performance: { hints: false },
    plugins: [
      new CustomFunctionsMetadataPlugin({ output: 'functions.json', input: './src/functions/functions.ts' }),
      new HtmlWebpackPlugin({ filename: 'taskpane.html', template: './src/taskpane/taskpane.html', chunks: ['functions', 'taskpane'], inject: 'body', scriptLoading: 'blocking' }),
      new CopyWebpackPlugin({
        patterns: [
          { from: 'assets/*.png', to: '[name][ext]' },
          { from: 'src/taskpane/taskpane.css', to: 'taskpane.css' },
          { from: 'README.md', to: 'README.md' },
          {
            from: 'manifest/manifest.xml',
            to: 'manifest.xml',
            transform: (content) => (production ? content.toString().split(DEV_ORIGIN).join(PROD_ORIGIN) : content),
          },
        ],
      }),
      ...(production ? [new ProductionUrlsPlugin()] : []),
    ],
  };
};
