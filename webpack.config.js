// Builds dist/: functions.json (from functions.ts JSDoc), the functions and taskpane bundles
// sharing one runtime page (taskpane.html) and one engine chunk, the help pages, the icons and
// the manifest.
const fs = require('fs');
const path = require('path');
const CustomFunctionsMetadataPlugin = require('custom-functions-metadata-plugin');
const HtmlWebpackPlugin = require('html-webpack-plugin');
const CopyWebpackPlugin = require('copy-webpack-plugin');
const { renderHelpPages } = require('./scripts/lib/helpPages');

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

/** Renders README.md and docs/support.md to help.html and support.html (markdown-it), rebuilt when either changes. */
class HelpPagesPlugin {
  apply(compiler) {
    const sources = { readme: path.resolve(__dirname, 'README.md'), support: path.resolve(__dirname, 'docs/support.md') };
    compiler.hooks.thisCompilation.tap('HelpPagesPlugin', (compilation) => {
      compilation.hooks.processAssets.tap({ name: 'HelpPagesPlugin', stage: compiler.webpack.Compilation.PROCESS_ASSETS_STAGE_ADDITIONAL }, () => {
        for (const file of Object.values(sources)) compilation.fileDependencies.add(file);
        const pages = renderHelpPages(fs.readFileSync(sources.readme, 'utf8'), fs.readFileSync(sources.support, 'utf8'));
        for (const [name, text] of Object.entries(pages)) compilation.emitAsset(name, new compiler.webpack.sources.RawSource(text));
      });
      // a @helpurl written as README.md#anchor (the older form) lands on the rendered page too
      compilation.hooks.processAssets.tap({ name: 'HelpPagesPlugin', stage: compiler.webpack.Compilation.PROCESS_ASSETS_STAGE_OPTIMIZE }, (assets) => {
        const json = assets['functions.json'];
        if (json) compilation.updateAsset('functions.json', new compiler.webpack.sources.RawSource(json.source().toString().split('/README.md#').join('/help.html#')));
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
    // One engine in the shared runtime: the functions and the pane run in the same page, so the
    // engine, catalogue and cell layer they both import go into one chunk (shared.js) with one
    // webpack runtime (runtime.js), and every module, cache and custom-system store exists once.
    optimization: {
      runtimeChunk: 'single',
      splitChunks: {
        chunks: 'all',
        cacheGroups: {
          default: false,
          defaultVendors: false,
          shared: { name: 'shared', chunks: 'initial', minChunks: 2, minSize: 0, enforce: true },
        },
      },
    },
    plugins: [
      new CustomFunctionsMetadataPlugin({ output: 'functions.json', input: './src/functions/functions.ts' }),
      new HtmlWebpackPlugin({ filename: 'taskpane.html', template: './src/taskpane/taskpane.html', chunks: ['functions', 'taskpane'], inject: 'body', scriptLoading: 'blocking' }),
      new CopyWebpackPlugin({
        patterns: [
          { from: 'assets/*.png', to: '[name][ext]' },
          { from: 'src/taskpane/taskpane.css', to: 'taskpane.css' },
          {
            from: 'manifest/manifest.xml',
            to: 'manifest.xml',
            transform: (content) => (production ? content.toString().split(DEV_ORIGIN).join(PROD_ORIGIN) : content),
          },
        ],
      }),
      new HelpPagesPlugin(),
      ...(production ? [new ProductionUrlsPlugin()] : []),
    ],
  };
};
