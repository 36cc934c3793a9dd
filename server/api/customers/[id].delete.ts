export default entityDeleteRoute('customers')
