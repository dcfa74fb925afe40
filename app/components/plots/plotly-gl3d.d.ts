// plotly.js-gl3d-dist-min ships no types; its API is the full bundle's, which plotly.js-dist-min describes.
declare module "plotly.js-gl3d-dist-min" {
  import Plotly from "plotly.js-dist-min";
  export default Plotly;
}
